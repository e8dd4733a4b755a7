import { z } from 'zod';
import { idSchema } from './common.ts';
import { createRunBodySchema } from './runs.ts';

export const SWEEP_MAX_VALUES_PER_AXIS = 25;
export const SWEEP_MAX_POINTS = 100;

export const sweepAxisSchema = z.strictObject({
  /** A path from SWEEPABLE_PARAMETERS (shared/contracts/scenario.ts), e.g. "envelope.alpha". */
  path: z.string({ error: 'path is required' }).min(1).max(100),
  values: z
    .array(z.number({ error: 'values must be numbers' }), { error: 'values must be a list of numbers' })
    .min(2, { error: 'values must hold at least 2 numbers' })
    .max(SWEEP_MAX_VALUES_PER_AXIS, { error: `values must hold at most ${SWEEP_MAX_VALUES_PER_AXIS} numbers` }),
});

export const createSweepBodySchema = z
  .strictObject({
    scenarioId: idSchema,
    name: z.string().trim().min(1).max(160).optional(),
    /** One axis for a curve, two for a grid (row-major: the second axis varies fastest). */
    axes: z.array(sweepAxisSchema).min(1, { error: 'axes must hold one or two axes' }).max(2, { error: 'axes must hold one or two axes' }),
    systems: createRunBodySchema.shape.systems,
    seed: createRunBodySchema.shape.seed,
  })
  .superRefine((body, ctx) => {
    const points = body.axes.reduce((n, a) => n * a.values.length, 1);
    if (points > SWEEP_MAX_POINTS) ctx.addIssue({ code: 'custom', path: ['axes'], message: `axes make ${points} grid points; a sweep may have at most ${SWEEP_MAX_POINTS}` });
    if (body.axes.length === 2 && body.axes[0].path === body.axes[1].path) ctx.addIssue({ code: 'custom', path: ['axes', 1, 'path'], message: 'axes[1].path must differ from axes[0].path' });
  });
export type CreateSweepBody = z.infer<typeof createSweepBodySchema>;

export const sweepQuerySchema = z.strictObject({ sample: idSchema.optional() });

export const sweepPointSchema = z.object({
  index: z.number(),
  values: z.array(z.number()),
  runId: z.string(),
  status: z.string(),
  fraction: z.number().nullable(),
  fractionSe: z.number().nullable(),
  whiteDwarfs: z.number().nullable(),
  magnetic: z.number().nullable(),
  /** With a counts sample: the exact two-sided binomial p-value of the sample against this point's prediction. */
  pValue: z.number().nullable(),
  consistent68: z.boolean().nullable(),
  consistent95: z.boolean().nullable(),
});

export const sweepSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  scenarioId: z.string(),
  scenarioVersion: z.number(),
  axes: z.array(z.object({ path: z.string(), values: z.array(z.number()), label: z.string(), unit: z.string() })),
  seed: z.string(),
  systems: z.number(),
  pointCount: z.number(),
  pointsDone: z.number(),
  status: z.enum(['queued', 'running', 'finished', 'cancelled']),
  createdAt: z.string(),
});
export type SweepSummary = z.infer<typeof sweepSummarySchema>;

export const sweepDetailSchema = sweepSummarySchema.extend({
  points: z.array(sweepPointSchema),
  /** The observed band of the chosen sample (fraction with 68% and 95% intervals). */
  band: z
    .object({ sampleId: z.string(), name: z.string(), fraction: z.number(), interval68: z.tuple([z.number(), z.number()]).nullable(), interval95: z.tuple([z.number(), z.number()]).nullable() })
    .nullable(),
  /** 1-D sweeps with a counts sample: the parameter range whose predictions the sample does not reject. */
  allowedRange: z.object({ level68: z.tuple([z.number(), z.number()]).nullable(), level95: z.tuple([z.number(), z.number()]).nullable(), note: z.string() }).nullable(),
  method: z.string(),
});
export type SweepDetail = z.infer<typeof sweepDetailSchema>;
export const sweepListResponseSchema = z.object({ sweeps: z.array(sweepSummarySchema) });
