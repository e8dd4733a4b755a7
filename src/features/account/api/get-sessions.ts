import { queryOptions, useQuery } from '@tanstack/react-query';
import { sessionListSchema } from '../../../../shared/contracts/settings.ts';
import { api } from '../../../lib/api-client.ts';

export function getSessions(signal?: AbortSignal) {
  return api.get('/api/me/sessions', { schema: sessionListSchema, signal });
}

export const getSessionsQueryOptions = (userId: string) => queryOptions({ queryKey: ['me', userId, 'sessions'], queryFn: ({ signal }) => getSessions(signal) });

export function useSessions(userId: string) {
  return useQuery(getSessionsQueryOptions(userId));
}
