import { queryOptions, useQuery } from '@tanstack/react-query';
import { runSummarySchema } from '../../../../shared/contracts/runs.ts';
import { api } from '../../../lib/api-client.ts';

const LIVE = new Set(['queued', 'running']);
/** How often the run is asked again while it computes. */
export const IMPLIED_POLL_MS = 1_500;

export function getImpliedRun(id: string, signal?: AbortSignal) {
  return api.get(`/api/runs/${encodeURIComponent(id)}`, { schema: runSummarySchema, signal });
}

/** The run behind the answer, asked again until it has finished. */
export const getImpliedRunQueryOptions = (departmentId: string, id: string) =>
  queryOptions({
    queryKey: ['runs', departmentId, 'for-implied-occurrence', id],
    queryFn: ({ signal }) => getImpliedRun(id, signal),
    refetchInterval: (query) => (query.state.data && !LIVE.has(query.state.data.status) ? false : IMPLIED_POLL_MS),
  });

export function useImpliedRun(departmentId: string, id: string) {
  return useQuery(getImpliedRunQueryOptions(departmentId, id));
}
