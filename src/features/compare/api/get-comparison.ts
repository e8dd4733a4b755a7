import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { scenarioResultSchema } from '../../../../shared/contracts/result.ts';
import { runSummarySchema } from '../../../../shared/contracts/runs.ts';
import { api } from '../../../lib/api-client.ts';

/*
 * GET /api/compare declares only "an object" in its contract; its shape is written here from the
 * server (runs.service.ts, compare), out of the shared run-summary and result schemas.
 */
const result = scenarioResultSchema.shape;
export const comparedRunSchema = z.object({
  run: runSummarySchema,
  fraction: result.fraction,
  fractionBySetting: result.fractionBySetting,
  fractionByChannel: result.fractionByChannel,
  counts: result.counts,
  bins: z.object({ wdMass: result.bins.shape.wdMass, logField: result.bins.shape.logField }),
});
export const runComparisonResponseSchema = z.object({
  runs: z.array(comparedRunSchema),
  differences: z.array(z.object({ a: z.string(), b: z.string(), difference: z.number(), sigma: z.number().nullable() })),
  method: z.string(),
});
export type ComparedRun = z.output<typeof comparedRunSchema>;
export type RunsComparison = z.output<typeof runComparisonResponseSchema>;

export function getComparison(runIds: readonly string[], signal?: AbortSignal) {
  return api.get(`/api/compare?runs=${runIds.map(encodeURIComponent).join(',')}`, { schema: runComparisonResponseSchema, signal });
}

/** Finished runs never change, so a comparison of them does not either. */
export const getComparisonQueryOptions = (departmentId: string, runIds: readonly string[]) =>
  queryOptions({
    queryKey: ['compare', departmentId, [...runIds]],
    queryFn: ({ signal }) => getComparison(runIds, signal),
    staleTime: Infinity,
  });

export function useComparison(departmentId: string, runIds: readonly string[]) {
  return useQuery(getComparisonQueryOptions(departmentId, runIds));
}
