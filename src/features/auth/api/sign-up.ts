import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponseSchema, type SignUpBody } from '../../../../shared/contracts/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { getMeQueryOptions } from './get-me.ts';

/** Creates the account and signs in (201, session cookie set). */
export function signUp(body: SignUpBody) {
  return api.post('/api/auth/sign-up', { body, schema: meResponseSchema });
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (me) => queryClient.setQueryData(getMeQueryOptions().queryKey, me),
  });
}
