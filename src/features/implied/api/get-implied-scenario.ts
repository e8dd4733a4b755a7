import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioDetailSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** One scenario resolved: its systems and seed, and the occurrence rows the multiplier scales. */
export function getImpliedScenario(id: string, signal?: AbortSignal) {
  return api.get(`/api/scenarios/${encodeURIComponent(id)}`, { schema: scenarioDetailSchema, signal });
}

export const getImpliedScenarioQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: ['scenarios', departmentId, 'detail-for-implied-occurrence', id], queryFn: ({ signal }) => getImpliedScenario(id, signal) });

/** Not asked until a scenario is known. */
export function useImpliedScenario(departmentId: string, id: string | null) {
  return useQuery({ ...getImpliedScenarioQueryOptions(departmentId, id ?? ''), enabled: Boolean(id) });
}
