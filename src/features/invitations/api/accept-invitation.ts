import { useMutation } from '@tanstack/react-query';
import { meResponseSchema } from '../../../../shared/contracts/auth.ts';
import type { AcceptInvitationBody } from '../../../../shared/contracts/invitations.ts';
import { api } from '../../../lib/api-client.ts';

/**
 * Signs a new user in, or adds the signed-in user to the department (which becomes the active
 * one). The caller puts the returned session into the cache (the route owns that).
 */
export function acceptInvitation(body: AcceptInvitationBody) {
  return api.post('/api/invitations/accept', { body, schema: meResponseSchema });
}

export function useAcceptInvitation() {
  return useMutation({ mutationFn: acceptInvitation });
}
