import { queryOptions, useQuery } from '@tanstack/react-query';
import { sweepListResponseSchema, type SweepSummary } from '../../../../shared/contracts/sweeps.ts';
import { api } from '../../../lib/api-client.ts';

export function getSweeps(signal?: AbortSignal) {
  return api.get('/api/sweeps', { schema: sweepListResponseSchema, signal });
}

/** Every sweep query of a department sits under this key, so one invalidation refreshes them all. */
export const sweepsKey = (departmentId: string) => ['sweeps', departmentId] as const;

/** How often a sweep that is still computing is asked again. */
export const SWEEP_POLL_MS = 2_000;

export const isSweepLive = (status: SweepSummary['status']) => status === 'queued' || status === 'running';

/** The department's sweeps, newest first; asked again while any of them is still computing. */
export const getSweepsQueryOptions = (departmentId: string) =>
  queryOptions({
    queryKey: [...sweepsKey(departmentId), 'list'],
    queryFn: ({ signal }) => getSweeps(signal),
    refetchInterval: (query) => (query.state.data?.sweeps.some((s) => isSweepLive(s.status)) ? SWEEP_POLL_MS : false),
  });

export function useSweeps(departmentId: string) {
  return useQuery(getSweepsQueryOptions(departmentId));
}
