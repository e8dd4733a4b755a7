import { queryOptions, useQuery } from '@tanstack/react-query';
import { sharedObjectSchema } from '../../../../shared/contracts/shares.ts';
import { api } from '../../../lib/api-client.ts';

/** A shared run or sweep, read without signing in. */
export function getSharedObject(token: string, signal?: AbortSignal) {
  return api.get(`/api/shared/${encodeURIComponent(token)}`, { schema: sharedObjectSchema, signal });
}

export const getSharedObjectQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['shared', token], queryFn: ({ signal }) => getSharedObject(token, signal), retry: false });

export function useSharedObject(token: string) {
  return useQuery(getSharedObjectQueryOptions(token));
}
