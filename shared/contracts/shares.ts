import { z } from 'zod';
import { exportListingSchema } from './exports.ts';
import { scenarioResultSchema } from './result.ts';
import { sweepDetailSchema } from './sweeps.ts';

export const SHARE_KINDS = ['run', 'sweep'] as const;
export type ShareKind = (typeof SHARE_KINDS)[number];

/** The answer to creating a link: the secret URL, shown once. */
export const createShareResponseSchema = z.object({ id: z.string(), url: z.string() });

export const shareLinkSummarySchema = z.object({
  id: z.string(),
  kind: z.enum(SHARE_KINDS),
  objectId: z.string(),
  /** The scenario name of a run, the name of a sweep. */
  label: z.string(),
  prefix: z.string(),
  createdByName: z.string(),
  createdAt: z.string(),
  lastOpenedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type ShareLinkSummary = z.infer<typeof shareLinkSummarySchema>;
export const shareLinkListSchema = z.object({ links: z.array(shareLinkSummarySchema) });

export const shareTokenParamsSchema = z.object({ token: z.string().max(100) });

/** What a shared run shows: no owner, no cost, no other objects of the department. */
export const sharedRunSchema = z.object({
  id: z.string(),
  scenarioName: z.string(),
  scenarioHash: z.string(),
  systems: z.number(),
  seed: z.string(),
  engineVersion: z.string(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});

export const sharedObjectSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('run'),
    run: sharedRunSchema,
    result: scenarioResultSchema,
    methods: z.string(),
    exports: exportListingSchema,
  }),
  z.object({
    kind: z.literal('sweep'),
    sweep: sweepDetailSchema.omit({ points: true, scenarioId: true }).extend({
      points: z.array(sweepDetailSchema.shape.points.element.omit({ runId: true })),
    }),
    exports: exportListingSchema,
  }),
]);
export type SharedObject = z.infer<typeof sharedObjectSchema>;
