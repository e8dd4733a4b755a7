import { useMutation, useQueryClient } from '@tanstack/react-query';
import { messageResponseSchema } from '../../../../shared/contracts/settings.ts';
import { api } from '../../../lib/api-client.ts';
import { getMeQueryOptions } from '../../../lib/api/get-me.ts';

export function saveName(body: { name: string }) {
  return api.put('/api/me/name', { body, schema: messageResponseSchema });
}

/** The shell shows the name from the session's /me, which is asked again afterwards. */
export function useSaveName() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveName, onSuccess: () => queryClient.invalidateQueries({ queryKey: getMeQueryOptions().queryKey }) });
}
