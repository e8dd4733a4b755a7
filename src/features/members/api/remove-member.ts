import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { getMembersQueryOptions } from './get-members.ts';

/** 204; 409 when it would leave the department without an admin. */
export function removeMember(userId: string) {
  return api.delete(`/api/members/${encodeURIComponent(userId)}`);
}

export function useRemoveMember(departmentId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = getMembersQueryOptions(departmentId);
  return useMutation({
    mutationFn: removeMember,
    onSuccess: (_, userId) => {
      queryClient.setQueryData(queryKey, (list) => list && { members: list.members.filter((m) => m.userId !== userId) });
      return queryClient.invalidateQueries({ queryKey });
    },
  });
}
