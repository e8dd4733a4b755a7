import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioVersionsResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { scenariosKey } from './get-scenarios.ts';

/** Every saved version of a scenario with its document, newest first. */
export function getScenarioVersions(id: string, signal?: AbortSignal) {
  return api.get(`/api/scenarios/${encodeURIComponent(id)}/versions`, { schema: scenarioVersionsResponseSchema, signal });
}

export const getScenarioVersionsQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: [...scenariosKey(departmentId), 'versions', id], queryFn: ({ signal }) => getScenarioVersions(id, signal) });

export function useScenarioVersions(departmentId: string, id: string) {
  return useQuery(getScenarioVersionsQueryOptions(departmentId, id));
}
