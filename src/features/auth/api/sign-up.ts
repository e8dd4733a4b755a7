import { useMutation } from '@tanstack/react-query';
import { meResponseSchema, type SignUpBody } from '../../../../shared/contracts/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { useSetMe } from '../../../lib/api/get-me.ts';

/** Creates the account and a department with the user as its admin; signs in (201, cookie set). */
export function signUp(body: SignUpBody) {
  return api.post('/api/auth/sign-up', { body, schema: meResponseSchema });
}

export function useSignUp() {
  return useMutation({ mutationFn: signUp, onSuccess: useSetMe() });
}
