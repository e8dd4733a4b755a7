import { queryOptions, useQuery } from '@tanstack/react-query';
import { memberListResponseSchema } from '../../../../shared/contracts/members.ts';
import { api } from '../../../lib/api-client.ts';

/** The active department's members (admins only). */
export function getMembers(signal?: AbortSignal) {
  return api.get('/api/members', { schema: memberListResponseSchema, signal });
}

/**
 * The server answers for the session's active department; the key names it too, so that a
 * department switch never shows the previous department's list.
 */
export const getMembersQueryOptions = (departmentId: string) =>
  queryOptions({
    queryKey: ['members', departmentId],
    queryFn: ({ signal }) => getMembers(signal),
  });

export function useMembers(departmentId: string) {
  return useQuery(getMembersQueryOptions(departmentId));
}
