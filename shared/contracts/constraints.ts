import { z } from 'zod';
import { idSchema, nameSchema } from './common.ts';

/**
 * Constraint sets: the observations a run is judged by, all at once. Each kind names its test
 * statistic and the published method (server/modules/constraints/evaluate.ts applies them):
 * - `fraction`: magnetic k of n in one setting — exact two-sided binomial test (as R's binom.test);
 *   or a published value ± error — Gaussian test with the errors in quadrature; or a lower bound
 *   without an error — a check, not a test.
 * - `meanMass`: a mean mass ± error — Gaussian test against the model's grouped mean (Sheppard's
 *   correction for the bin width); or a list of masses — Kolmogorov–Smirnov test on grouped data
 *   at the model's bin edges (Noether 1963; Conover 1972), two-sample size (Smirnov 1939).
 * - `fieldDistribution`: a list of fields above a survey threshold — the same grouped KS test on
 *   log10 B, with the model restricted to bins above the threshold.
 * - `coolingAgeIncidence`: magnetic k_i of n_i per cooling-age bin — an exact binomial test per
 *   bin, combined by Fisher's method.
 * - `postCommonEnvelopePeriods`: a list of post-CE periods — the grouped KS test on log10 P.
 * The prediction's Monte Carlo error is carried into every test.
 */

const COUNT_MAX = 1e8;
const count = (field: string) =>
  z
    .number({ error: `${field} must be a whole number` })
    .int({ error: `${field} must be a whole number` })
    .min(0, { error: `${field} must be between 0 and ${COUNT_MAX}` })
    .max(COUNT_MAX, { error: `${field} must be between 0 and ${COUNT_MAX}` });
const ranged = (field: string, lo: number, hi: number, unit = '') =>
  z
    .number({ error: `${field} must be a number` })
    .min(lo, { error: `${field} must be between ${lo} and ${hi}${unit}` })
    .max(hi, { error: `${field} must be between ${lo} and ${hi}${unit}` });
const positive = (field: string, hi: number, unit = '') =>
  z
    .number({ error: `${field} must be a number` })
    .gt(0, { error: `${field} must be above 0 and at most ${hi}${unit}` })
    .max(hi, { error: `${field} must be above 0 and at most ${hi}${unit}` });

export const LIST_MAX = 100_000;
const list = (field: string, item: z.ZodNumber) =>
  z.array(item).min(1, { error: `${field} must hold at least one value` }).max(LIST_MAX, { error: `${field} holds at most ${LIST_MAX} values` });

/** Settings a constraint may describe; detachedCompanion = wide or post-CE. */
export const CONSTRAINT_SETTINGS = ['all', 'single', 'wide', 'postCE', 'detachedCompanion'] as const;
export type ConstraintSetting = (typeof CONSTRAINT_SETTINGS)[number];

const common = {
  label: z.string().trim().max(200).optional(),
  citation: z.string().max(1000).optional(),
  /** Free text: where the numbers come from, how they were read. */
  note: z.string().max(4000).optional(),
  /** CSV text in place of the list (lists only; see CONSTRAINT_CSV_COLUMNS): parsed on save, never stored as text. */
  csv: z.string().max(2_000_000).optional(),
};

export const fractionConstraintSchema = z
  .strictObject({
    kind: z.literal('fraction'),
    setting: z.enum(CONSTRAINT_SETTINGS).default('all'),
    magnetic: count('magnetic').optional(),
    total: count('total').optional(),
    value: ranged('value', 0, 1).optional(),
    error: positive('error', 1).optional(),
    /** The value is a lower bound without an uncertainty (checked, not tested). */
    bound: z.literal('lower').optional(),
    fieldThresholdMG: ranged('fieldThresholdMG', 0.001, 1000, ' MG').optional(),
    ...common,
  })
  .superRefine((c, ctx) => {
    const counts = c.magnetic !== undefined || c.total !== undefined;
    if (counts && c.value !== undefined) ctx.addIssue({ code: 'custom', path: ['value'], message: 'give either magnetic and total or value (± error), not both' });
    if (counts) {
      if (c.magnetic === undefined) ctx.addIssue({ code: 'custom', path: ['magnetic'], message: 'magnetic is required with total' });
      if (c.total === undefined || c.total < 1) ctx.addIssue({ code: 'custom', path: ['total'], message: `total must be at least 1 (got ${c.total})` });
      else if (c.magnetic !== undefined && c.magnetic > c.total) ctx.addIssue({ code: 'custom', path: ['magnetic'], message: `magnetic must not exceed total = ${c.total} (got ${c.magnetic})` });
    } else if (c.value === undefined) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: 'give magnetic and total, or value with error (or bound: "lower")' });
    } else if (c.error === undefined && c.bound === undefined) {
      ctx.addIssue({ code: 'custom', path: ['error'], message: 'error is required with value (or mark the value as bound: "lower")' });
    }
  });

export const meanMassConstraintSchema = z
  .strictObject({
    kind: z.literal('meanMass'),
    population: z.enum(['magnetic', 'nonMagnetic']).default('magnetic'),
    setting: z.enum(['all', 'single', 'wide', 'postCE']).default('all'),
    meanMsun: ranged('meanMsun', 0.1, 1.44, ' Msun').optional(),
    errorMsun: positive('errorMsun', 1, ' Msun').optional(),
    massesMsun: list('massesMsun', ranged('massesMsun[]', 0.1, 1.5, ' Msun')).optional(),
    ...common,
  })
  .superRefine((c, ctx) => {
    const mean = c.meanMsun !== undefined;
    const masses = c.massesMsun !== undefined || c.csv !== undefined;
    if (mean === masses) ctx.addIssue({ code: 'custom', path: ['meanMsun'], message: 'give either meanMsun with errorMsun or a list massesMsun (or csv), exactly one' });
    if (mean && c.errorMsun === undefined) ctx.addIssue({ code: 'custom', path: ['errorMsun'], message: 'errorMsun is required with meanMsun' });
  });

export const fieldDistributionConstraintSchema = z
  .strictObject({
    kind: z.literal('fieldDistribution'),
    /** The survey's detection threshold: only fields above it are compared. */
    thresholdMG: ranged('thresholdMG', 0.001, 1000, ' MG').default(1),
    fieldsMG: list('fieldsMG', positive('fieldsMG[]', 1e5, ' MG')).optional(),
    ...common,
  })
  .superRefine((c, ctx) => {
    if (c.fieldsMG === undefined && c.csv === undefined) ctx.addIssue({ code: 'custom', path: ['fieldsMG'], message: 'fieldsMG (or csv) is required' });
  });

export const coolingAgeBinSchema = z.strictObject({
  ageMinGyr: ranged('ageMinGyr', 0, 14, ' Gyr'),
  ageMaxGyr: ranged('ageMaxGyr', 0.001, 14, ' Gyr'),
  magnetic: count('magnetic'),
  total: count('total'),
});
export type CoolingAgeBin = z.infer<typeof coolingAgeBinSchema>;

export const coolingAgeIncidenceConstraintSchema = z
  .strictObject({
    kind: z.literal('coolingAgeIncidence'),
    bins: z.array(coolingAgeBinSchema).min(1, { error: 'bins must hold at least one bin' }).max(50).optional(),
    ...common,
  })
  .superRefine((c, ctx) => {
    if (c.bins === undefined && c.csv === undefined) ctx.addIssue({ code: 'custom', path: ['bins'], message: 'bins (or csv) is required' });
    c.bins?.forEach((b, i) => {
      if (!(b.ageMinGyr < b.ageMaxGyr)) ctx.addIssue({ code: 'custom', path: ['bins', i, 'ageMaxGyr'], message: `bins[${i}].ageMaxGyr must be above ageMinGyr = ${b.ageMinGyr} (got ${b.ageMaxGyr})` });
      if (b.total < 1) ctx.addIssue({ code: 'custom', path: ['bins', i, 'total'], message: `bins[${i}].total must be at least 1 (got ${b.total})` });
      else if (b.magnetic > b.total) ctx.addIssue({ code: 'custom', path: ['bins', i, 'magnetic'], message: `bins[${i}].magnetic must not exceed total = ${b.total} (got ${b.magnetic})` });
    });
  });

export const postCommonEnvelopePeriodsConstraintSchema = z
  .strictObject({
    kind: z.literal('postCommonEnvelopePeriods'),
    population: z.enum(['all', 'magnetic', 'nonMagnetic']).default('all'),
    periodsDays: list('periodsDays', positive('periodsDays[]', 1e4, ' d')).optional(),
    ...common,
  })
  .superRefine((c, ctx) => {
    if (c.periodsDays === undefined && c.csv === undefined) ctx.addIssue({ code: 'custom', path: ['periodsDays'], message: 'periodsDays (or csv) is required' });
  });

/** A constraint of the read-only library, by its id (GET /api/constraint-library). */
export const libraryReferenceSchema = z.strictObject({ libraryId: z.string().min(1).max(80) });

export const observedConstraintSchema = z.discriminatedUnion('kind', [
  fractionConstraintSchema,
  meanMassConstraintSchema,
  fieldDistributionConstraintSchema,
  coolingAgeIncidenceConstraintSchema,
  postCommonEnvelopePeriodsConstraintSchema,
]);
export const constraintSchema = z.union([observedConstraintSchema, libraryReferenceSchema]);
export type ObservedConstraint = z.output<typeof observedConstraintSchema>;
export type ConstraintInput = z.input<typeof constraintSchema>;
export type Constraint = z.output<typeof constraintSchema>;
export type ConstraintKind = ObservedConstraint['kind'];
export const CONSTRAINT_KINDS = ['fraction', 'meanMass', 'fieldDistribution', 'coolingAgeIncidence', 'postCommonEnvelopePeriods'] as const;

/** The CSV layout of each kind that holds a list (header row required). */
export const CONSTRAINT_CSV_COLUMNS = {
  meanMass: ['massMsun'],
  fieldDistribution: ['fieldMG'],
  postCommonEnvelopePeriods: ['periodDays'],
  coolingAgeIncidence: ['ageMinGyr', 'ageMaxGyr', 'magnetic', 'total'],
} as const;

/**
 * POST /api/constraint-sets, PUT /api/constraint-sets/:id. Each constraint is checked on its own
 * by parseConstraint (a library reference or one of the kinds), so that an error names the
 * constraint's index and field rather than "matches no form".
 */
export const constraintSetBodySchema = z.strictObject({
  name: nameSchema,
  constraints: z
    .array(z.record(z.string(), z.unknown()))
    .min(1, { error: 'constraints must hold at least one constraint' })
    .max(50, { error: 'constraints holds at most 50 constraints' }),
  note: z.string().max(4000).optional(),
});
export type ConstraintSetBody = { name: string; constraints: ConstraintInput[]; note?: string };

/** Picks the schema a raw constraint must satisfy: a library reference when it names libraryId. */
export function constraintSchemaFor(raw: Record<string, unknown>): z.ZodType {
  return 'libraryId' in raw ? libraryReferenceSchema : observedConstraintSchema;
}

export const libraryConstraintSchema = z.object({
  id: z.string(),
  name: z.string(),
  constraint: observedConstraintSchema,
  citation: z.string(),
  /** How the paper states it, and anything Tidefield assumed in reading it. */
  provenance: z.string(),
  fromMemory: z.boolean(),
});
export type LibraryConstraint = z.output<typeof libraryConstraintSchema>;
/** GET /api/constraint-library; the whole library is also a set with the id "library". */
export const constraintLibraryResponseSchema = z.object({ constraints: z.array(libraryConstraintSchema), setId: z.literal('library') });
export const LIBRARY_SET_ID = 'library';

export const constraintSetSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  currentVersion: z.number(),
  constraintCount: z.number(),
  kinds: z.array(z.enum(CONSTRAINT_KINDS)),
  library: z.boolean(),
  updatedAt: z.string(),
});
export const constraintSetSchema = constraintSetSummarySchema.extend({
  constraints: z.array(constraintSchema),
  note: z.string().nullable(),
  versions: z.array(z.object({ version: z.number(), createdAt: z.string(), createdByUserId: z.string().nullable() })),
});
export type ConstraintSetSummary = z.output<typeof constraintSetSummarySchema>;
export type ConstraintSet = z.output<typeof constraintSetSchema>;
export const constraintSetListResponseSchema = z.object({ constraintSets: z.array(constraintSetSummarySchema) });
export const constraintSetQuerySchema = z.strictObject({ constraintSet: z.union([idSchema, z.literal(LIBRARY_SET_ID)]) });

/** GET /api/runs/:id/evaluation?constraintSet=ID. Infinite σ (a prediction of exactly 0 refuted) arrives as null. */
export const constraintEvaluationSchema = z.object({
  id: z.string(),
  kind: z.enum(CONSTRAINT_KINDS),
  label: z.string(),
  /** available: scored; notTestable: shown without a p (a bound, a value without an error); unavailable: the run lacks the observable. */
  status: z.enum(['scored', 'notTestable', 'unavailable']),
  predicted: z.string(),
  observed: z.string(),
  p: z.number().nullable(),
  sigma: z.number().nullable(),
  logLikelihood: z.number().nullable(),
  mcLimited: z.boolean(),
  verdict: z.string(),
  method: z.string(),
  citation: z.string().nullable(),
  caveats: z.array(z.string()),
  /** For chart overlays: the observed list binned on the model's edges (lists only). */
  overlay: z
    .object({ chart: z.enum(['wdMass', 'logField', 'coolingAge', 'postCommonEnvelopePeriod']), edges: z.array(z.number()), observed: z.array(z.number()), predicted: z.array(z.number()) })
    .nullable(),
});
export type ConstraintEvaluation = z.output<typeof constraintEvaluationSchema>;
export const evaluationResponseSchema = z.object({
  runId: z.string().optional(),
  constraintSet: z.object({ id: z.string(), name: z.string(), version: z.number().nullable() }),
  constraints: z.array(constraintEvaluationSchema),
  combined: z.object({
    logLikelihood: z.number().nullable(),
    p: z.number().nullable(),
    sigma: z.number().nullable(),
    scored: z.number(),
    method: z.string(),
    verdict: z.string(),
  }),
});
export type Evaluation = z.output<typeof evaluationResponseSchema>;

/** POST /api/stats/two-sample. */
const sampleCounts = z
  .strictObject({ magnetic: count('magnetic'), total: count('total') })
  .superRefine((s, ctx) => {
    if (s.total < 1) ctx.addIssue({ code: 'custom', path: ['total'], message: `total must be at least 1 (got ${s.total})` });
    else if (s.magnetic > s.total) ctx.addIssue({ code: 'custom', path: ['magnetic'], message: `magnetic must not exceed total = ${s.total} (got ${s.magnetic})` });
  });
export const twoSampleBodySchema = z.strictObject({ a: sampleCounts, b: sampleCounts });
export type TwoSampleBody = z.infer<typeof twoSampleBodySchema>;
const sampleSummary = z.object({
  magnetic: z.number(),
  total: z.number(),
  fraction: z.number(),
  interval68: z.tuple([z.number(), z.number()]),
  interval95: z.tuple([z.number(), z.number()]),
});
export const twoSampleResponseSchema = z.object({
  a: sampleSummary,
  b: sampleSummary,
  p: z.number(),
  sigma: z.number().nullable(),
  verdict: z.string(),
  method: z.string(),
  intervalMethod: z.string(),
});
export type TwoSampleResponse = z.output<typeof twoSampleResponseSchema>;
