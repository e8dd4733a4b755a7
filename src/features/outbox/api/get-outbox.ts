import { queryOptions, useQuery } from '@tanstack/react-query';
import { outboxResponseSchema } from '../../../../shared/contracts/account.ts';
import { api } from '../../../lib/api-client.ts';

/** Mail the local SMTP stand-in received for the active department (admins; development). */
export function getOutbox(signal?: AbortSignal) {
  return api.get('/api/outbox', { schema: outboxResponseSchema, signal });
}

export const getOutboxQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['outbox', departmentId], queryFn: ({ signal }) => getOutbox(signal), staleTime: 0 });

export function useOutbox(departmentId: string) {
  return useQuery({ ...getOutboxQueryOptions(departmentId), refetchInterval: 5000 });
}
