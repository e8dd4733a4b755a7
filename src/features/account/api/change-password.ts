import { useMutation, useQueryClient } from '@tanstack/react-query';
import { messageResponseSchema } from '../../../../shared/contracts/settings.ts';
import { api } from '../../../lib/api-client.ts';
import { getSessionsQueryOptions } from './get-sessions.ts';

/** 400 at currentPassword when it is wrong, at password when the new one is too short. Other sessions end. */
export function changePassword(body: { currentPassword: string; password: string }) {
  return api.put('/api/me/password', { body, schema: messageResponseSchema });
}

export function useChangePassword(userId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: changePassword, onSuccess: () => queryClient.invalidateQueries({ queryKey: getSessionsQueryOptions(userId).queryKey }) });
}
