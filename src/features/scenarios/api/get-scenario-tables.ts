import { queryOptions, useQuery } from '@tanstack/react-query';
import { tableListResponseSchema } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's stored occurrence tables, for a scenario's companions to name by id. */
export function getScenarioTables(signal?: AbortSignal) {
  return api.get('/api/occurrence-tables', { schema: tableListResponseSchema, signal });
}

// Under the occurrence tables' own key prefix, so storing or deleting a table refreshes the choice.
export const getScenarioTablesQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['occurrence-tables', departmentId, 'choices-for-scenarios'], queryFn: ({ signal }) => getScenarioTables(signal) });

export function useScenarioTables(departmentId: string) {
  return useQuery(getScenarioTablesQueryOptions(departmentId));
}
