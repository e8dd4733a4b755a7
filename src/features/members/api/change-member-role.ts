import { useMutation, useQueryClient } from '@tanstack/react-query';
import { memberSchema, type ChangeRoleBody } from '../../../../shared/contracts/members.ts';
import { api } from '../../../lib/api-client.ts';
import { getMembersQueryOptions } from './get-members.ts';

export interface ChangeMemberRoleInput extends ChangeRoleBody {
  userId: string;
}

/** 409 when the change would leave the department without an admin. */
export function changeMemberRole({ userId, role }: ChangeMemberRoleInput) {
  return api.patch(`/api/members/${encodeURIComponent(userId)}`, { body: { role }, schema: memberSchema });
}

export function useChangeMemberRole(departmentId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = getMembersQueryOptions(departmentId);
  return useMutation({
    mutationFn: changeMemberRole,
    onSuccess: (member) => {
      queryClient.setQueryData(queryKey, (list) =>
        list && { members: list.members.map((m) => (m.userId === member.userId ? member : m)) },
      );
      return queryClient.invalidateQueries({ queryKey });
    },
  });
}
