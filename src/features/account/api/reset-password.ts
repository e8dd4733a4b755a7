import { useMutation } from '@tanstack/react-query';
import type { PasswordResetConfirm } from '../../../../shared/contracts/account.ts';
import { api } from '../../../lib/api-client.ts';

/** 204; 404 for an unknown link, 410 for a used or expired one (field "token"). */
export function resetPassword(body: PasswordResetConfirm) {
  return api.post('/api/auth/password-reset/confirm', { body });
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
