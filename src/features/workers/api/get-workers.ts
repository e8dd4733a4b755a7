import { queryOptions, useQuery } from '@tanstack/react-query';
import { workersResponseSchema } from '../../../../shared/contracts/workers.ts';
import { api } from '../../../lib/api-client.ts';

/** The compute workers (admins): the app's own pool, or the BullMQ workers over Redis. */
export function getWorkers(signal?: AbortSignal) {
  return api.get('/api/workers', { schema: workersResponseSchema, signal });
}

export const getWorkersQueryOptions = () => queryOptions({ queryKey: ['workers'], queryFn: ({ signal }) => getWorkers(signal), staleTime: 0 });

export function useWorkers() {
  return useQuery({ ...getWorkersQueryOptions(), refetchInterval: 3000 });
}
