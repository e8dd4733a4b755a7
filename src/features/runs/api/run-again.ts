import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RunAgainBody } from '../../../../shared/contracts/runs.ts';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { runListKey } from './get-runs.ts';

/** Queues the run's own scenario document again (a sweep's point keeps its values); 400 names `systems` or `seed`, 403 above an observer's limit. */
export function runAgain(runId: string, body: RunAgainBody) {
  return api.post(`/api/runs/${encodeURIComponent(runId)}/again`, { body, schema: idResponseSchema });
}

export function useRunAgain(departmentId: string, runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RunAgainBody) => runAgain(runId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: runListKey(departmentId) }),
  });
}
