import { queryOptions, useQuery } from '@tanstack/react-query';
import { runSummarySchema, type RunStatus } from '../../../../shared/contracts/runs.ts';
import { api } from '../../../lib/api-client.ts';

export const FINAL_STATUSES: readonly RunStatus[] = ['succeeded', 'failed', 'cancelled'];
export const isFinalStatus = (status: RunStatus) => FINAL_STATUSES.includes(status);

export function getRun(id: string, signal?: AbortSignal) {
  return api.get(`/api/runs/${encodeURIComponent(id)}`, { schema: runSummarySchema, signal });
}

/** How often to ask while the progress stream is unavailable. */
export const RUN_POLL_MS = 2_000;

/**
 * One run: status, progress, ETA and the headline fraction. With `poll`, it is asked again every
 * two seconds until the run has finished (the fallback when server-sent events fail).
 */
export const getRunQueryOptions = (departmentId: string, id: string, poll = false) =>
  queryOptions({
    queryKey: ['runs', departmentId, 'detail', id],
    queryFn: ({ signal }) => getRun(id, signal),
    refetchInterval: (query) => (poll && query.state.data && !isFinalStatus(query.state.data.status) ? RUN_POLL_MS : false),
  });

export function useRun(departmentId: string, id: string, poll = false) {
  return useQuery(getRunQueryOptions(departmentId, id, poll));
}
