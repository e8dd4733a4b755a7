import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createShareResponseSchema, type ShareKind } from '../../../../shared/contracts/shares.ts';
import { api } from '../../../lib/api-client.ts';
import { getShareLinksQueryOptions } from './get-share-links.ts';

/** 201 with the link's URL: the only time the server sends its secret. */
export function createShareLink(kind: ShareKind, id: string) {
  return api.post(`/api/${kind === 'run' ? 'runs' : 'sweeps'}/${encodeURIComponent(id)}/share`, { schema: createShareResponseSchema });
}

export function useCreateShareLink(departmentId: string, kind: ShareKind, id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => createShareLink(kind, id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getShareLinksQueryOptions(departmentId).queryKey }),
  });
}
