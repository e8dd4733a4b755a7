import { queryOptions, useQuery } from '@tanstack/react-query';
import { fitDetailSchema } from '../../../../shared/contracts/fits.ts';
import { api } from '../../../lib/api-client.ts';
import { FIT_POLL_MS, fitsKey, isFitLive } from './get-fits.ts';

export function getFit(id: string, signal?: AbortSignal) {
  return api.get(`/api/fits/${encodeURIComponent(id)}`, { schema: fitDetailSchema, signal });
}

/** A fit; asked again every two seconds while it computes (live progress). */
export const getFitQueryOptions = (departmentId: string, id: string) =>
  queryOptions({
    queryKey: [...fitsKey(departmentId), 'detail', id],
    queryFn: ({ signal }) => getFit(id, signal),
    refetchInterval: (query) => (query.state.data && isFitLive(query.state.data.status) ? FIT_POLL_MS : false),
  });

export function useFit(departmentId: string, id: string) {
  return useQuery(getFitQueryOptions(departmentId, id));
}
