import { queryOptions, useQuery } from '@tanstack/react-query';
import { runComparisonResponseSchema } from '../../../../shared/contracts/comparison.ts';
export type { ComparedRun, RunsComparison } from '../../../../shared/contracts/comparison.ts';
import { api } from '../../../lib/api-client.ts';

export function getComparison(runIds: readonly string[], signal?: AbortSignal) {
  return api.get(`/api/compare?runs=${runIds.map(encodeURIComponent).join(',')}`, { schema: runComparisonResponseSchema, signal });
}

/** Finished runs never change, so a comparison of them does not either. */
export const getComparisonQueryOptions = (departmentId: string, runIds: readonly string[]) =>
  queryOptions({
    queryKey: ['compare', departmentId, [...runIds]],
    queryFn: ({ signal }) => getComparison(runIds, signal),
    staleTime: Infinity,
  });

export function useComparison(departmentId: string, runIds: readonly string[]) {
  return useQuery(getComparisonQueryOptions(departmentId, runIds));
}
