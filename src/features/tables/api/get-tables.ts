import { queryOptions, useQuery } from '@tanstack/react-query';
import { tableListResponseSchema } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's stored occurrence tables (without their rows). */
export function getTables(signal?: AbortSignal) {
  return api.get('/api/occurrence-tables', { schema: tableListResponseSchema, signal });
}

/** Every occurrence-table query of a department sits under this key (the scenario builder's table choice too). */
export const tablesKey = (departmentId: string) => ['occurrence-tables', departmentId] as const;

export const getTablesQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: [...tablesKey(departmentId), 'list'], queryFn: ({ signal }) => getTables(signal) });

export function useTables(departmentId: string) {
  return useQuery(getTablesQueryOptions(departmentId));
}
