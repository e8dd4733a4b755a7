import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createTokenResponseSchema, type CreateTokenBody } from '../../../../shared/contracts/tokens.ts';
import { api } from '../../../lib/api-client.ts';
import { getTokensQueryOptions } from './get-tokens.ts';

/** 201 with the token's secret in `token`: the only time the server ever sends it. */
export function createToken(body: CreateTokenBody) {
  return api.post('/api/tokens', { body, schema: createTokenResponseSchema });
}

export function useCreateToken(departmentId: string, userId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = getTokensQueryOptions(departmentId, userId);
  return useMutation({
    mutationFn: createToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey }),
  });
}
