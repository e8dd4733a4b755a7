import { useMutation } from '@tanstack/react-query';
import { passwordResetRequestedSchema } from '../../../../shared/contracts/account.ts';
import { api } from '../../../lib/api-client.ts';

/** 202 with the same message whether or not the address has an account; 429 after too many requests. */
export function requestPasswordReset(body: { email: string }) {
  return api.post('/api/auth/password-reset', { body, schema: passwordResetRequestedSchema });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
