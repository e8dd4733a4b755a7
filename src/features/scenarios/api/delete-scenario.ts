import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { scenariosKey } from './get-scenarios.ts';

/** Deletes a scenario; runs made from it keep their own copy of the document. */
export function deleteScenario(id: string) {
  return api.delete(`/api/scenarios/${encodeURIComponent(id)}`);
}

export function useDeleteScenario(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteScenario,
    // Marked stale without refetching at once: the page being left would only ask for the deleted scenario again.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scenariosKey(departmentId), refetchType: 'none' }),
  });
}
