import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, isApiError } from '../../../lib/api-client.ts';
import { isMeQuery, useSetMe } from '../../../lib/api/get-me.ts';

/** Ends the session (204). A 401 means it had already ended, which is just as good. */
export async function signOut(): Promise<void> {
  try {
    await api.post('/api/auth/sign-out');
  } catch (error) {
    if (!(isApiError(error) && error.status === 401)) throw error;
  }
}

export function useSignOut() {
  const queryClient = useQueryClient();
  const setMe = useSetMe();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // Nothing of the previous user's stays in memory for the next one.
      queryClient.removeQueries({ predicate: (query) => !isMeQuery(query) });
      setMe(null);
    },
  });
}
