import { queryOptions, useQuery } from '@tanstack/react-query';
import { sampleSchema } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';
import { samplesKey } from './get-samples.ts';

/** One sample (the department's or the library's) with its Clopper–Pearson intervals. */
export function getSample(id: string, signal?: AbortSignal) {
  return api.get(`/api/samples/${encodeURIComponent(id)}`, { schema: sampleSchema, signal });
}

export const getSampleQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: [...samplesKey(departmentId), 'detail', id], queryFn: ({ signal }) => getSample(id, signal) });

export function useSample(departmentId: string, id: string) {
  return useQuery(getSampleQueryOptions(departmentId, id));
}
