import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioDetailSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** One scenario with its document resolved: its systems, seed and the values a sweep would vary. */
export function getSweepScenario(id: string, signal?: AbortSignal) {
  return api.get(`/api/scenarios/${encodeURIComponent(id)}`, { schema: scenarioDetailSchema, signal });
}

export const getSweepScenarioQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: ['scenarios', departmentId, 'detail-for-sweeps', id], queryFn: ({ signal }) => getSweepScenario(id, signal) });

/** Not asked until a scenario is chosen. */
export function useSweepScenario(departmentId: string, id: string | null) {
  return useQuery({ ...getSweepScenarioQueryOptions(departmentId, id ?? ''), enabled: Boolean(id) });
}
