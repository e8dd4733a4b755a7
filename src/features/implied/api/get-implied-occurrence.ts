import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { impliedOccurrenceSchema } from '../../../../shared/contracts/result.ts';
import { api } from '../../../lib/api-client.ts';

/**
 * The answer of GET /api/runs/:id/implied-occurrence. The route declares its body only as an
 * object, so the client checks the fields it reads: the engine's ImpliedOccurrence
 * (shared/contracts/result.ts) plus the run, the sample's counts and the run's own multiplier.
 */
export const impliedAnswerSchema = impliedOccurrenceSchema.extend({
  runId: z.string(),
  sample: z.object({ id: z.string(), name: z.string(), magnetic: z.number(), total: z.number() }),
  runMultiplier: z.number(),
});
export type ImpliedAnswerResponse = z.infer<typeof impliedAnswerSchema>;

export function getImpliedOccurrence(runId: string, sampleId: string, signal?: AbortSignal) {
  return api.get(`/api/runs/${encodeURIComponent(runId)}/implied-occurrence?${new URLSearchParams({ sample: sampleId })}`, {
    schema: impliedAnswerSchema,
    signal,
  });
}

export const getImpliedOccurrenceQueryOptions = (departmentId: string, runId: string, sampleId: string) =>
  queryOptions({
    queryKey: ['runs', departmentId, 'implied-occurrence', runId, sampleId],
    queryFn: ({ signal }) => getImpliedOccurrence(runId, sampleId, signal),
    // A finished run's answer never changes.
    staleTime: Infinity,
  });

/** Asked once the run has succeeded. */
export function useImpliedOccurrence(departmentId: string, runId: string, sampleId: string, enabled: boolean) {
  return useQuery({ ...getImpliedOccurrenceQueryOptions(departmentId, runId, sampleId), enabled });
}
