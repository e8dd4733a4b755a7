import { queryOptions, useQuery } from '@tanstack/react-query';
import { shareLinkListSchema } from '../../../../shared/contracts/shares.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's share links (never their secrets). */
export function getShareLinks(signal?: AbortSignal) {
  return api.get('/api/share-links', { schema: shareLinkListSchema, signal });
}

export const getShareLinksQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['share-links', departmentId], queryFn: ({ signal }) => getShareLinks(signal) });

export function useShareLinks(departmentId: string) {
  return useQuery(getShareLinksQueryOptions(departmentId));
}
