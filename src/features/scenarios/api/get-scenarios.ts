import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioListResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's scenarios (current version of each), newest change first. */
export function getScenarios(signal?: AbortSignal) {
  return api.get('/api/scenarios', { schema: scenarioListResponseSchema, signal });
}

/** Every scenario query of a department sits under this key, so one invalidation refreshes lists, details and versions. */
export const scenariosKey = (departmentId: string) => ['scenarios', departmentId] as const;

export const getScenariosQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: [...scenariosKey(departmentId), 'list'], queryFn: ({ signal }) => getScenarios(signal) });

export function useScenarios(departmentId: string) {
  return useQuery(getScenariosQueryOptions(departmentId));
}
