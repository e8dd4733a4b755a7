import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioListResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's scenarios, to choose the one to sweep and to name a sweep's scenario. */
export function getSweepScenarios(signal?: AbortSignal) {
  return api.get('/api/scenarios', { schema: scenarioListResponseSchema, signal });
}

export const getSweepScenariosQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['scenarios', departmentId, 'choices-for-sweeps'], queryFn: ({ signal }) => getSweepScenarios(signal) });

export function useSweepScenarios(departmentId: string) {
  return useQuery(getSweepScenariosQueryOptions(departmentId));
}
