import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioResultSchema } from '../../../../shared/contracts/result.ts';
import { api } from '../../../lib/api-client.ts';

export function getRunResult(id: string, signal?: AbortSignal) {
  return api.get(`/api/runs/${encodeURIComponent(id)}/result`, { schema: scenarioResultSchema, signal });
}

/** A finished run's result document; it never changes, so it is fetched once. */
export const getRunResultQueryOptions = (departmentId: string, id: string) =>
  queryOptions({
    queryKey: ['runs', departmentId, 'result', id],
    queryFn: ({ signal }) => getRunResult(id, signal),
    staleTime: Infinity,
  });

/** Asked only once the run has succeeded (before that the server answers 409). */
export function useRunResult(departmentId: string, id: string, enabled: boolean) {
  return useQuery({ ...getRunResultQueryOptions(departmentId, id), enabled });
}
