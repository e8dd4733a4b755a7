import { z } from 'zod';
import { impliedOccurrenceSchema, observedComparisonSchema, scenarioResultSchema } from './result.ts';
import { runSummarySchema } from './runs.ts';
import { sampleSchema } from './samples.ts';

/** GET /api/runs/:id/comparison?sample=ID — a finished run set against a sample of any kind. */
export const countsComparisonSchema = observedComparisonSchema.extend({
  label: z.string(),
  predictedCounts: z.object({ magnetic: z.number(), whiteDwarfs: z.number() }),
});

export const fractionConstraintSchema = z.object({
  published: z.object({ fraction: z.number(), sigma: z.number().nullable(), lowerBound: z.boolean() }),
  predicted: z.object({ value: z.number(), se: z.number() }),
  z: z.number().nullable(),
  pValue: z.number().nullable(),
  sigma: z.number().nullable(),
  consistent: z.boolean().nullable(),
  summary: z.string(),
  method: z.string(),
});

export const meanMassSideSchema = z.object({
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

/** GET /api/compare?runs=a,b — two to four finished runs on the same axes. */
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
export type MeanMassComparison = z.output<typeof runComparisonSchema>['meanMass'];

/** GET /api/runs/:id/implied-occurrence?sample=ID — the multiplier range a counts sample allows. */
export const runImpliedOccurrenceSchema = impliedOccurrenceSchema.extend({
  runId: z.string(),
  sample: z.object({ id: z.string(), name: z.string(), magnetic: z.number(), total: z.number() }),
  runMultiplier: z.number(),
});
