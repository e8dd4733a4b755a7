import { hashKey, queryOptions, useQuery, useQueryClient, type Query } from '@tanstack/react-query';
import { meResponseSchema, type MeResponse } from '../../../shared/contracts/auth.ts';
import { api, isApiError } from '../api-client.ts';

/** The signed-in user with the active department, or null when signed out (401). */
export async function getMe(signal?: AbortSignal): Promise<MeResponse | null> {
  try {
    return await api.get('/api/me', { schema: meResponseSchema, signal });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: ['me'],
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

export function useMe() {
  return useQuery(getMeQueryOptions());
}

/** For cache sweeps that must spare the session itself (sign-out, department switch). */
export function isMeQuery(query: Query): boolean {
  return query.queryHash === hashKey(getMeQueryOptions().queryKey);
}

/** Stores a MeResponse that a mutation answered (sign-in, sign-up, department switch) as the session. */
export function useSetMe() {
  const queryClient = useQueryClient();
  return (me: MeResponse | null) => queryClient.setQueryData(getMeQueryOptions().queryKey, me);
}
