import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { getShareLinksQueryOptions } from './get-share-links.ts';

export function revokeShareLink(id: string) {
  return api.delete(`/api/share-links/${encodeURIComponent(id)}`);
}

export function useRevokeShareLink(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeShareLink,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getShareLinksQueryOptions(departmentId).queryKey }),
  });
}
