import { queryOptions, useQuery } from '@tanstack/react-query';
import { fitListResponseSchema, type FitSummary } from '../../../../shared/contracts/fits.ts';
import { api } from '../../../lib/api-client.ts';

export function getFits(signal?: AbortSignal) {
  return api.get('/api/fits', { schema: fitListResponseSchema, signal });
}

/** Every fit query of a department sits under this key. */
export const fitsKey = (departmentId: string) => ['fits', departmentId] as const;

/** How often a fit that is still computing is asked again. */
export const FIT_POLL_MS = 2_000;

export const isFitLive = (status: FitSummary['status']) => status === 'queued' || status === 'running';

/** The department's fits, newest first; asked again while any of them is still computing. */
export const getFitsQueryOptions = (departmentId: string) =>
  queryOptions({
    queryKey: [...fitsKey(departmentId), 'list'],
    queryFn: ({ signal }) => getFits(signal),
    refetchInterval: (query) => (query.state.data?.fits.some((f) => isFitLive(f.status)) ? FIT_POLL_MS : false),
  });

export function useFits(departmentId: string) {
  return useQuery(getFitsQueryOptions(departmentId));
}
