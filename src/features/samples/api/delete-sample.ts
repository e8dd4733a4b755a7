import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { getSamplesQueryOptions } from './get-samples.ts';

/** 204; 403 for a library entry. */
export function deleteSample(id: string) {
  return api.delete(`/api/samples/${encodeURIComponent(id)}`);
}

export function useDeleteSample(departmentId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = getSamplesQueryOptions(departmentId);
  return useMutation({
    mutationFn: deleteSample,
    // Only the list: the deleted sample's own page is being left and must not ask for it again.
    onSuccess: (_, id) => {
      queryClient.setQueryData(queryKey, (list) => list && { samples: list.samples.filter((s) => s.id !== id) });
      return queryClient.invalidateQueries({ queryKey });
    },
  });
}
