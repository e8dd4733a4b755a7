import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { isMeQuery, useSetMe } from '../../../lib/api/get-me.ts';

/** Ends every session of the account, this one included (204). */
export function signOutEverywhere(): Promise<unknown> {
  return api.post('/api/me/sessions/sign-out-everywhere');
}

export function useSignOutEverywhere() {
  const queryClient = useQueryClient();
  const setMe = useSetMe();
  return useMutation({
    mutationFn: signOutEverywhere,
    onSuccess: () => {
      queryClient.removeQueries({ predicate: (query) => !isMeQuery(query) });
      setMe(null);
    },
  });
}
