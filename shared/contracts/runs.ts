import { z } from 'zod';
import { idSchema, pageInfoSchema, pageQueryFields } from './common.ts';

export const RUN_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export const runStatusSchema = z.enum(RUN_STATUSES);
export type RunStatus = z.infer<typeof runStatusSchema>;

export const createRunBodySchema = z.strictObject({
  scenarioId: idSchema,
  /** Run an older version of the scenario (default: the current one). */
  version: z.number().int().min(1).optional(),
  /** Override the document's number of primaries. */
  systems: z
    .number({ error: 'systems must be a whole number from 1000 to 10000000000' })
    .int({ error: 'systems must be a whole number from 1000 to 10000000000' })
    .min(1e3, { error: 'systems must be between 1000 and 10000000000' })
    .max(1e10, { error: 'systems must be between 1000 and 10000000000' })
    .optional(),
  /** Override the document's seed. */
  seed: z.string().min(1, { error: 'seed must not be empty' }).max(200, { error: 'seed must be at most 200 characters' }).optional(),
});
export type CreateRunBody = z.infer<typeof createRunBodySchema>;

export const RUN_SORT_FIELDS = ['createdAt', 'systems', 'fraction', 'status', 'scenarioName', 'finishedAt'] as const;
export const runListQuerySchema = z.strictObject({
  ...pageQueryFields,
  sort: z.enum(RUN_SORT_FIELDS).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  status: runStatusSchema.optional(),
  scenarioId: idSchema.optional(),
  /** "me" lists only the caller's own runs. */
  owner: z.enum(['me', 'any']).default('any'),
  /** Sweep points are listed under their sweep; set to true to list them here too. */
  includeSweepPoints: z.enum(['true', 'false']).default('false'),
  /** Text filter on the scenario name. */
  q: z.string().max(100).optional(),
});
export type RunListQuery = z.infer<typeof runListQuerySchema>;

export const runSummarySchema = z.object({
  id: z.string(),
  scenarioId: z.string(),
  scenarioName: z.string(),
  scenarioVersion: z.number(),
  scenarioHash: z.string(),
  status: runStatusSchema,
  progress: z.number(),
  chunksDone: z.number(),
  chunkCount: z.number(),
  systems: z.number(),
  seed: z.string(),
  engineVersion: z.string(),
  costCredits: z.number(),
  whiteDwarfs: z.number().nullable(),
  magnetic: z.number().nullable(),
  fraction: z.number().nullable(),
  fractionSe: z.number().nullable(),
  ownerUserId: z.string(),
  ownerName: z.string(),
  sweepId: z.string().nullable(),
  sweepPointIndex: z.number().nullable(),
  error: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  computeMs: z.number(),
  resumes: z.number(),
  /** Seconds left, estimated from this run's own pace (null when not running or too early to tell). */
  etaSeconds: z.number().nullable(),
  /** Only in GET /runs/:id, for a sweep's grid point: its sweep, its number (1-based) and its parameter values. */
  sweepPoint: z
    .object({
      sweepId: z.string(),
      sweepName: z.string(),
      number: z.number(),
      pointCount: z.number(),
      values: z.array(z.object({ path: z.string(), label: z.string(), unit: z.string(), value: z.number() })),
    })
    .nullable()
    .optional(),
});
export type RunSummary = z.infer<typeof runSummarySchema>;
export const runListResponseSchema = z.object({ runs: z.array(runSummarySchema), page: pageInfoSchema });

/** One message of the progress stream (server-sent events, event name "progress"). */
export const runProgressEventSchema = z.object({
  id: z.string(),
  status: runStatusSchema,
  progress: z.number(),
  chunksDone: z.number(),
  chunkCount: z.number(),
  etaSeconds: z.number().nullable(),
  error: z.string().nullable(),
});
export type RunProgressEvent = z.infer<typeof runProgressEventSchema>;

export const sampleQuerySchema = z.strictObject({ sample: idSchema });
export const compareQuerySchema = z.strictObject({
  /** Two to four run ids, comma-separated. */
  runs: z
    .string({ error: 'runs is required: two to four run ids, comma-separated' })
    .transform((s) => s.split(',').map((x) => x.trim()).filter(Boolean))
    .pipe(z.array(idSchema).min(2, { error: 'runs must list two to four run ids' }).max(4, { error: 'runs must list two to four run ids' })),
  sample: idSchema.optional(),
});

/** Run a run's own scenario document again (a sweep's point keeps its values); size and seed may change. */
export const runAgainBodySchema = z.strictObject({
  systems: createRunBodySchema.shape.systems,
  seed: createRunBodySchema.shape.seed,
});
export type RunAgainBody = z.infer<typeof runAgainBodySchema>;
