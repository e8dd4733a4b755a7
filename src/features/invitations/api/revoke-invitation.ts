import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { getInvitationsQueryOptions } from './get-invitations.ts';

/** 204; the link stops working at once. */
export function revokeInvitation(id: string) {
  return api.delete(`/api/invitations/${encodeURIComponent(id)}`);
}

export function useRevokeInvitation(departmentId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = getInvitationsQueryOptions(departmentId);
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: (_, id) => {
      queryClient.setQueryData(queryKey, (list) => list && { invitations: list.invitations.filter((i) => i.id !== id) });
      return queryClient.invalidateQueries({ queryKey });
    },
  });
}
