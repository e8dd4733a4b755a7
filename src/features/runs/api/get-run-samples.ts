import { queryOptions, useQuery } from '@tanstack/react-query';
import { sampleListResponseSchema } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's observed samples and the library of published constraints, to set a run against. */
export function getRunSamples(signal?: AbortSignal) {
  return api.get('/api/samples', { schema: sampleListResponseSchema, signal });
}

export const getRunSamplesQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['samples', departmentId, 'choices-for-runs'], queryFn: ({ signal }) => getRunSamples(signal) });

export function useRunSamples(departmentId: string) {
  return useQuery(getRunSamplesQueryOptions(departmentId));
}
