import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioDetailSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** One scenario with its resolved document: the run form's default systems and seed. */
export function getRunScenario(id: string, signal?: AbortSignal) {
  return api.get(`/api/scenarios/${encodeURIComponent(id)}`, { schema: scenarioDetailSchema, signal });
}

export const getRunScenarioQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: ['scenarios', departmentId, 'detail-for-runs', id], queryFn: ({ signal }) => getRunScenario(id, signal) });

export function useRunScenario(departmentId: string, id: string | null) {
  return useQuery({ ...getRunScenarioQueryOptions(departmentId, id ?? ''), enabled: Boolean(id) });
}
