import { queryOptions, useQuery } from '@tanstack/react-query';
import { sampleListResponseSchema } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's own samples and the read-only library of published constraints. */
export function getSamples(signal?: AbortSignal) {
  return api.get('/api/samples', { schema: sampleListResponseSchema, signal });
}

/** Every query of this feature sits under this key, so one invalidation refreshes list and details. */
export const samplesKey = (departmentId: string) => ['samples', departmentId] as const;

export const getSamplesQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: [...samplesKey(departmentId), 'list'], queryFn: ({ signal }) => getSamples(signal) });

export function useSamples(departmentId: string) {
  return useQuery(getSamplesQueryOptions(departmentId));
}
