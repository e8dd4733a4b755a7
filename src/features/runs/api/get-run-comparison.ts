import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { observedComparisonSchema } from '../../../../shared/contracts/result.ts';
import { sampleSchema } from '../../../../shared/contracts/samples.ts';
import { api } from '../../../lib/api-client.ts';

/*
 * GET /api/runs/:id/comparison declares only "an object" in its contract, so its shape is
 * written here from the server's RunComparison (server/modules/runs/comparison.ts), built
 * on the shared observedComparisonSchema.
 */
const countsComparisonSchema = observedComparisonSchema.extend({
  label: z.string(),
  predictedCounts: z.object({ magnetic: z.number(), whiteDwarfs: z.number() }),
});

const fractionConstraintSchema = z.object({
  published: z.object({ fraction: z.number(), sigma: z.number().nullable(), lowerBound: z.boolean() }),
  predicted: z.object({ value: z.number(), se: z.number() }),
  z: z.number().nullable(),
  pValue: z.number().nullable(),
  sigma: z.number().nullable(),
  consistent: z.boolean().nullable(),
  summary: z.string(),
  method: z.string(),
});

const meanMassSideSchema = z.object({
  publishedMsun: z.number(),
  publishedSigma: z.number(),
  predictedMsun: z.number().nullable(),
  predictedSdMsun: z.number().nullable(),
  z: z.number().nullable(),
});

export const runComparisonSchema = z.object({
  sample: z.object({
    id: z.string(),
    name: z.string(),
    kind: sampleSchema.shape.kind,
    library: z.boolean(),
    citation: z.string().nullable(),
    setting: sampleSchema.shape.setting,
  }),
  counts: countsComparisonSchema.nullable(),
  splits: z.array(countsComparisonSchema),
  fraction: fractionConstraintSchema.nullable(),
  meanMass: z.object({ magnetic: meanMassSideSchema, nonMagnetic: meanMassSideSchema, summary: z.string(), method: z.string() }).nullable(),
  caveats: z.array(z.string()),
});
export type RunComparison = z.output<typeof runComparisonSchema>;
export type CountsComparison = z.output<typeof countsComparisonSchema>;
export type FractionConstraint = z.output<typeof fractionConstraintSchema>;

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
