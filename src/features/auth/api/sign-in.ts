import { useMutation } from '@tanstack/react-query';
import { meResponseSchema, type SignInBody } from '../../../../shared/contracts/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { useSetMe } from '../../../lib/api/get-me.ts';

/** 401 on wrong credentials, 429 after too many attempts (the message says when to retry). */
export function signIn(body: SignInBody) {
  return api.post('/api/auth/sign-in', { body, schema: meResponseSchema });
}

export function useSignIn() {
  return useMutation({ mutationFn: signIn, onSuccess: useSetMe() });
}
