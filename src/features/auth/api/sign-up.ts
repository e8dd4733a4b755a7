import { useMutation } from '@tanstack/react-query';
import { meResponseSchema, type SignUpBody } from '../../../../shared/contracts/auth.ts';
import { signUpRequestedSchema, type SignUpConfirm } from '../../../../shared/contracts/sign-up.ts';
import { api } from '../../../lib/api-client.ts';
import { useSetMe } from '../../../lib/api/get-me.ts';

/** Asks for an account and a department (202): the same answer for every address; the e-mail carries the link. */
export function signUp(body: SignUpBody) {
  return api.post('/api/auth/sign-up', { body, schema: signUpRequestedSchema });
}

export function useSignUp() {
  return useMutation({ mutationFn: signUp });
}

/** Opens the e-mailed link: creates the account and its department and signs in (201, cookie set). */
export function confirmSignUp(body: SignUpConfirm) {
  return api.post('/api/auth/sign-up/confirm', { body, schema: meResponseSchema });
}

export function useConfirmSignUp() {
  return useMutation({ mutationFn: confirmSignUp, onSuccess: useSetMe() });
}
