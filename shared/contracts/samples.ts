import { z } from 'zod';
import { nameSchema } from './common.ts';
import { integer, number } from './field-issues.ts';

const count = () => integer(0, 1e8);

export const SAMPLE_SETTINGS = ['all', 'single', 'detachedCompanion'] as const;
export const BIN_SETTINGS = ['single', 'wide', 'postCE', 'detachedCompanion'] as const;

export const sampleBinSchema = z.discriminatedUnion('kind', [
  /** Counts among white dwarfs of one setting (e.g. 0 magnetic among 40 with a detached companion). */
  z.strictObject({ kind: z.literal('setting'), setting: z.enum(BIN_SETTINGS), magnetic: count(), total: count() }),
  /** Counts among white dwarfs with a mass in [massMinMsun, massMaxMsun). */
  z.strictObject({
    kind: z.literal('massBin'),
    massMinMsun: number(0.1, 1.44),
    massMaxMsun: number(0.1, 1.44),
    magnetic: count(),
    total: count(),
  }),
]);
export type SampleBin = z.infer<typeof sampleBinSchema>;

function checkCounts(value: { magnetic: number; total: number; bins?: SampleBin[] }, ctx: z.RefinementCtx) {
  if (value.total < 1) ctx.addIssue({ code: 'custom', path: ['total'], message: `total must be at least 1 (got ${value.total})` });
  if (value.magnetic > value.total) ctx.addIssue({ code: 'custom', path: ['magnetic'], message: `magnetic must not exceed total = ${value.total} (got ${value.magnetic})` });
  value.bins?.forEach((bin, i) => {
    if (bin.magnetic > bin.total) ctx.addIssue({ code: 'custom', path: ['bins', i, 'magnetic'], message: `bins[${i}].magnetic must not exceed bins[${i}].total = ${bin.total} (got ${bin.magnetic})` });
    if (bin.kind === 'massBin' && !(bin.massMinMsun < bin.massMaxMsun)) {
      ctx.addIssue({ code: 'custom', path: ['bins', i, 'massMaxMsun'], message: `bins[${i}].massMaxMsun must be above massMinMsun = ${bin.massMinMsun} (got ${bin.massMaxMsun})` });
    }
  });
}

const sampleFields = {
  name: nameSchema,
  magnetic: count(),
  total: count(),
  setting: z.enum(SAMPLE_SETTINGS).default('all'),
  fieldThresholdMG: number(0.001, 1000).optional(),
  provenance: z.string().max(4000).optional(),
  bins: z.array(sampleBinSchema).max(50).optional(),
};

export const createSampleBodySchema = z.strictObject(sampleFields).superRefine(checkCounts);
export type CreateSampleBody = z.infer<typeof createSampleBodySchema>;
export const updateSampleBodySchema = createSampleBodySchema;

export const sampleSchema = z.object({
  id: z.string(),
  name: z.string(),
  /** True for the read-only library of published constraints every department sees. */
  library: z.boolean(),
  kind: z.enum(['counts', 'fraction', 'meanMass']),
  magnetic: z.number().nullable(),
  total: z.number().nullable(),
  fraction: z.number().nullable(),
  fractionSigma: z.number().nullable(),
  lowerBound: z.boolean(),
  meanMass: z
    .object({ magneticMsun: z.number(), magneticSigma: z.number(), nonMagneticMsun: z.number(), nonMagneticSigma: z.number() })
    .nullable(),
  fieldThresholdMG: z.number().nullable(),
  setting: z.enum(SAMPLE_SETTINGS),
  provenance: z.string().nullable(),
  citation: z.string().nullable(),
  bins: z.array(sampleBinSchema),
  /** Clopper–Pearson 68% and 95% intervals of magnetic / total (counts samples only). */
  interval68: z.tuple([z.number(), z.number()]).nullable(),
  interval95: z.tuple([z.number(), z.number()]).nullable(),
  updatedAt: z.string(),
});
export type Sample = z.infer<typeof sampleSchema>;
export const sampleListResponseSchema = z.object({ samples: z.array(sampleSchema) });
