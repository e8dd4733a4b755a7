import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { subscribeToRunEvents } from '../api/get-run-events.ts';
import { getRunQueryOptions, isFinalStatus, useRun } from '../api/get-run.ts';
import { runListKey } from '../api/get-runs.ts';

export type ProgressSource = 'stream' | 'polling' | 'none';

/**
 * A run that keeps itself up to date while it is queued or running: progress arrives over
 * server-sent events and is written into the run's query; if the stream fails, the run is
 * polled instead. When the run ends, its summary (fraction, finish time) is fetched once more.
 */
export function useLiveRun(departmentId: string, runId: string) {
  const queryClient = useQueryClient();
  const [streamFailed, setStreamFailed] = useState(false);
  const run = useRun(departmentId, runId, streamFailed);
  const status = run.data?.status;
  const live = status === 'queued' || status === 'running';

  useEffect(() => {
    if (!live || streamFailed) return;
    const { queryKey } = getRunQueryOptions(departmentId, runId);
    return subscribeToRunEvents(runId, {
      onProgress: (event) => {
        queryClient.setQueryData(queryKey, (old: RunSummary | undefined) => old && { ...old, ...event });
        if (isFinalStatus(event.status)) {
          void queryClient.invalidateQueries({ queryKey });
          void queryClient.invalidateQueries({ queryKey: runListKey(departmentId) });
        }
      },
      onFailure: () => setStreamFailed(true),
    });
  }, [live, streamFailed, departmentId, runId, queryClient]);

  const source: ProgressSource = !live ? 'none' : streamFailed ? 'polling' : 'stream';
  return { run, source };
}
