import { useMutation, useQueryClient } from '@tanstack/react-query';
import { messageResponseSchema } from '../../../../shared/contracts/settings.ts';
import { api } from '../../../lib/api-client.ts';
import { getMeQueryOptions } from '../../../lib/api/get-me.ts';

export function confirmEmailChange(body: { token: string }) {
  return api.post('/api/auth/email-change/confirm', { body, schema: messageResponseSchema });
}

export function useConfirmEmailChange() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: confirmEmailChange, onSuccess: () => queryClient.invalidateQueries({ queryKey: getMeQueryOptions().queryKey }) });
}
