import { queryOptions, useQuery } from '@tanstack/react-query';
import { tokenListResponseSchema } from '../../../../shared/contracts/tokens.ts';
import { api } from '../../../lib/api-client.ts';

/** The signed-in user's own tokens for the active department (never their secrets). */
export function getTokens(signal?: AbortSignal) {
  return api.get('/api/tokens', { schema: tokenListResponseSchema, signal });
}

/** Tokens belong to a user in a department: the key names both. */
export const getTokensQueryOptions = (departmentId: string, userId: string) =>
  queryOptions({ queryKey: ['tokens', departmentId, userId], queryFn: ({ signal }) => getTokens(signal) });

export function useTokens(departmentId: string, userId: string) {
  return useQuery(getTokensQueryOptions(departmentId, userId));
}
