import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { tablesKey } from './get-tables.ts';

/** Deletes a table; runs already made keep the rows they used. */
export function deleteTable(id: string) {
  return api.delete(`/api/occurrence-tables/${encodeURIComponent(id)}`);
}

export function useDeleteTable(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteTable,
    // Marked stale without refetching at once: the page being left would only ask for the deleted table again.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tablesKey(departmentId), refetchType: 'none' }),
  });
}
