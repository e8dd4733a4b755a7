import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { getTokensQueryOptions } from './get-tokens.ts';

/** 204; revoking a token twice changes nothing. */
export function revokeToken(id: string) {
  return api.delete(`/api/tokens/${encodeURIComponent(id)}`);
}

export function useRevokeToken(departmentId: string, userId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = getTokensQueryOptions(departmentId, userId);
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey }),
  });
}
