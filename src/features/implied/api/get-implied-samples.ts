import { queryOptions, useQuery } from '@tanstack/react-query';
import { sampleListResponseSchema } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';

/** The samples an observer may ask about (those with counts are usable). */
export function getImpliedSamples(signal?: AbortSignal) {
  return api.get('/api/samples', { schema: sampleListResponseSchema, signal });
}

export const getImpliedSamplesQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['samples', departmentId, 'choices-for-implied-occurrence'], queryFn: ({ signal }) => getImpliedSamples(signal) });

export function useImpliedSamples(departmentId: string) {
  return useQuery(getImpliedSamplesQueryOptions(departmentId));
}
