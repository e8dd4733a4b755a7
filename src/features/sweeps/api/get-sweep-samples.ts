import { queryOptions, useQuery } from '@tanstack/react-query';
import { sampleListResponseSchema } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';

/** Samples to set a sweep against: the department's and the library's. */
export function getSweepSamples(signal?: AbortSignal) {
  return api.get('/api/samples', { schema: sampleListResponseSchema, signal });
}

export const getSweepSamplesQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['samples', departmentId, 'choices-for-sweeps'], queryFn: ({ signal }) => getSweepSamples(signal) });

export function useSweepSamples(departmentId: string) {
  return useQuery(getSweepSamplesQueryOptions(departmentId));
}
