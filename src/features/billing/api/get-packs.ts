import { queryOptions, useQuery } from '@tanstack/react-query';
import { packListResponseSchema } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

export function getPacks(signal?: AbortSignal) {
  return api.get('/api/billing/packs', { schema: packListResponseSchema, signal });
}

export const getPacksQueryOptions = () => queryOptions({ queryKey: ['billing', 'packs'], queryFn: ({ signal }) => getPacks(signal), staleTime: 10 * 60_000 });

export function usePacks() {
  return useQuery(getPacksQueryOptions());
}
