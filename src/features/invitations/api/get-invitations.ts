import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationListResponseSchema } from '../../../../shared/contracts/invitations.ts';
import { api } from '../../../lib/api-client.ts';

/** The active department's open invitations (admins only). */
export function getInvitations(signal?: AbortSignal) {
  return api.get('/api/invitations', { schema: invitationListResponseSchema, signal });
}

export const getInvitationsQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['invitations', departmentId], queryFn: ({ signal }) => getInvitations(signal) });

export function useInvitations(departmentId: string) {
  return useQuery(getInvitationsQueryOptions(departmentId));
}
