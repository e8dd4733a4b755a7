import { queryOptions, useQuery } from '@tanstack/react-query';
import { tableDetailSchema } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { api } from '../../../lib/api-client.ts';
import { tablesKey } from './get-tables.ts';

/** One table with all its rows. */
export function getTable(id: string, signal?: AbortSignal) {
  return api.get(`/api/occurrence-tables/${encodeURIComponent(id)}`, { schema: tableDetailSchema, signal });
}

export const getTableQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: [...tablesKey(departmentId), 'detail', id], queryFn: ({ signal }) => getTable(id, signal) });

export function useTable(departmentId: string, id: string) {
  return useQuery(getTableQueryOptions(departmentId, id));
}
