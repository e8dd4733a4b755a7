import { useMutation, useQueryClient } from '@tanstack/react-query';
import { tableDetailSchema, type UpdateTableBody } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { api } from '../../../lib/api-client.ts';
import { getTableQueryOptions } from './get-table.ts';
import { tablesKey } from './get-tables.ts';

export interface UpdateTableInput {
  id: string;
  body: UpdateTableBody;
}

/** Renames a table or replaces all its rows; a bad row is answered with the field "rows.<i>.<column>". */
export function updateTable({ id, body }: UpdateTableInput) {
  return api.patch(`/api/occurrence-tables/${encodeURIComponent(id)}`, { body, schema: tableDetailSchema });
}

export function useUpdateTable(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateTable,
    onSuccess: (table) => {
      queryClient.setQueryData(getTableQueryOptions(departmentId, table.id).queryKey, table);
      return queryClient.invalidateQueries({ queryKey: tablesKey(departmentId) });
    },
  });
}
