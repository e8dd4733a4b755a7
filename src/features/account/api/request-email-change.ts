import { useMutation } from '@tanstack/react-query';
import { messageResponseSchema } from '../../../../shared/contracts/settings.ts';
import { api } from '../../../lib/api-client.ts';

/** 400 at currentPassword when it is wrong; 409 at email when another account uses the address. */
export function requestEmailChange(body: { email: string; currentPassword: string }) {
  return api.post('/api/me/email-change', { body, schema: messageResponseSchema });
}

export function useRequestEmailChange() {
  return useMutation({ mutationFn: requestEmailChange });
}
