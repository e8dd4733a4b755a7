import { queryOptions, useQuery } from '@tanstack/react-query';
import { runComparisonSchema } from '../../../../shared/contracts/comparison.ts';
export type { CountsComparison, FractionConstraint, RunComparison } from '../../../../shared/contracts/comparison.ts';
import { api } from '../../../lib/api-client.ts';

export function getRunComparison(runId: string, sampleId: string, signal?: AbortSignal) {
  const search = new URLSearchParams({ sample: sampleId });
  return api.get(`/api/runs/${encodeURIComponent(runId)}/comparison?${search}`, { schema: runComparisonSchema, signal });
}

export const getRunComparisonQueryOptions = (departmentId: string, runId: string, sampleId: string) =>
  queryOptions({
    queryKey: ['runs', departmentId, 'comparison', runId, sampleId],
    queryFn: ({ signal }) => getRunComparison(runId, sampleId, signal),
  });

/** The run set against one sample; nothing is asked until a sample is chosen. */
export function useRunComparison(departmentId: string, runId: string, sampleId: string | null) {
  return useQuery({ ...getRunComparisonQueryOptions(departmentId, runId, sampleId ?? ''), enabled: Boolean(sampleId) });
}
