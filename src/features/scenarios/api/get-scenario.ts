import { queryOptions, useQuery } from '@tanstack/react-query';
import { scenarioDetailSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { scenariosKey } from './get-scenarios.ts';

/** One scenario with its current document, the document as the engine sees it, and its list price. */
export function getScenario(id: string, signal?: AbortSignal) {
  return api.get(`/api/scenarios/${encodeURIComponent(id)}`, { schema: scenarioDetailSchema, signal });
}

export const getScenarioQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: [...scenariosKey(departmentId), 'detail', id], queryFn: ({ signal }) => getScenario(id, signal) });

export function useScenario(departmentId: string, id: string) {
  return useQuery(getScenarioQueryOptions(departmentId, id));
}
