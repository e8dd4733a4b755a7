import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioListResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's scenarios, to choose the one whose prediction the sample is read against. */
export function getImpliedScenarios(signal?: AbortSignal) {
  return api.get('/api/scenarios', { schema: scenarioListResponseSchema, signal });
}

export const getImpliedScenariosQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['scenarios', departmentId, 'choices-for-implied-occurrence'], queryFn: ({ signal }) => getImpliedScenarios(signal) });

export function useImpliedScenarios(departmentId: string) {
  return useQuery(getImpliedScenariosQueryOptions(departmentId));
}
