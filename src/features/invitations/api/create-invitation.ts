import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createInvitationResponseSchema, type CreateInvitationBody } from '../../../../shared/contracts/invitations.ts';
import { api } from '../../../lib/api-client.ts';
import { getInvitationsQueryOptions } from './get-invitations.ts';

/** 201 (with `emailed` false when the mail server refused it); 409 when the address is already a member. */
export function createInvitation(body: CreateInvitationBody) {
  return api.post('/api/invitations', { body, schema: createInvitationResponseSchema });
}

export function useCreateInvitation(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions(departmentId).queryKey }),
  });
}
