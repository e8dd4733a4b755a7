import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioListResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's scenarios, to choose the one to run. */
export function getRunScenarios(signal?: AbortSignal) {
  return api.get('/api/scenarios', { schema: scenarioListResponseSchema, signal });
}

export const getRunScenariosQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['scenarios', departmentId, 'choices-for-runs'], queryFn: ({ signal }) => getRunScenarios(signal) });

export function useRunScenarios(departmentId: string) {
  return useQuery(getRunScenariosQueryOptions(departmentId));
}
