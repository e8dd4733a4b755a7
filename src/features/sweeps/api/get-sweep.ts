import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { sweepDetailSchema } from '../../../../shared/contracts/sweeps.ts';
import { api } from '../../../lib/api-client.ts';
import { SWEEP_POLL_MS, isSweepLive, sweepsKey } from './get-sweeps.ts';

/** A sweep's points; with a sample, also its observed band, per-point p-values and the allowed range. */
export function getSweep(id: string, sampleId: string | null, signal?: AbortSignal) {
  const query = sampleId ? `?${new URLSearchParams({ sample: sampleId })}` : '';
  return api.get(`/api/sweeps/${encodeURIComponent(id)}${query}`, { schema: sweepDetailSchema, signal });
}

/** Asked again every two seconds while points are still queued or running. */
export const getSweepQueryOptions = (departmentId: string, id: string, sampleId: string | null) =>
  queryOptions({
    queryKey: [...sweepsKey(departmentId), 'detail', id, sampleId],
    queryFn: ({ signal }) => getSweep(id, sampleId, signal),
    refetchInterval: (query) => (query.state.data && isSweepLive(query.state.data.status) ? SWEEP_POLL_MS : false),
  });

/** Choosing another sample keeps the last answer on screen until the new one arrives. */
export function useSweep(departmentId: string, id: string, sampleId: string | null) {
  return useQuery({ ...getSweepQueryOptions(departmentId, id, sampleId), placeholderData: keepPreviousData });
}
