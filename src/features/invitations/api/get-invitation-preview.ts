import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationPreviewSchema } from '../../../../shared/contracts/invitations.ts';
import { api } from '../../../lib/api-client.ts';

/** What an invitation link offers; 404 unknown, 410 used, withdrawn or expired. */
export function getInvitationPreview(token: string, signal?: AbortSignal) {
  return api.get(`/api/invitations/preview/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema, signal });
}

export const getInvitationPreviewQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['invitation-preview', token], queryFn: ({ signal }) => getInvitationPreview(token, signal), retry: false });

export function useInvitationPreview(token: string) {
  return useQuery({ ...getInvitationPreviewQueryOptions(token), enabled: token.length > 0 });
}
