import { z } from 'zod';
import { idSchema } from './common.ts';
import { constraintSchema, evaluationResponseSchema, LIBRARY_SET_ID } from './constraints.ts';
import { impliedFitQuestionSchema } from './implied-occurrence.ts';
import { createRunBodySchema, runStatusSchema } from './runs.ts';

/** Largest number of grid nodes of one fit (the product of the parameters' points). */
export const FIT_MAX_POINTS = 10_000;
export const FIT_MAX_POINTS_PER_PARAMETER = 200;
export const FIT_MAX_PARAMETERS = 4;

export const fitParameterSchema = z.strictObject({
  /** A path from SWEEPABLE_PARAMETERS (shared/contracts/scenario.ts), e.g. "envelope.alpha". */
  path: z.string({ error: 'path is required' }).min(1).max(100),
  min: z.number({ error: 'min must be a number' }),
  max: z.number({ error: 'max must be a number' }),
  points: z
    .number({ error: `points must be a whole number from 2 to ${FIT_MAX_POINTS_PER_PARAMETER}` })
    .int({ error: `points must be a whole number from 2 to ${FIT_MAX_POINTS_PER_PARAMETER}` })
    .min(2, { error: `points must be from 2 to ${FIT_MAX_POINTS_PER_PARAMETER}` })
    .max(FIT_MAX_POINTS_PER_PARAMETER, { error: `points must be from 2 to ${FIT_MAX_POINTS_PER_PARAMETER}` }),
  /** Grid spacing: evenly in the value, or evenly in its logarithm. */
  scale: z.enum(['linear', 'log'], { error: 'scale must be "linear" or "log"' }).default('linear'),
  /** Prior density: uniform in the value, or uniform in its logarithm (∝ 1/value). */
  prior: z.enum(['uniform', 'logUniform'], { error: 'prior must be "uniform" or "logUniform"' }).default('uniform'),
});
export type FitParameter = z.output<typeof fitParameterSchema>;

const parametersSchema = z
  .array(fitParameterSchema, { error: 'parameters must be a list' })
  .min(1, { error: `parameters must hold 1 to ${FIT_MAX_PARAMETERS} parameters` })
  .max(FIT_MAX_PARAMETERS, { error: `parameters must hold 1 to ${FIT_MAX_PARAMETERS} parameters` })
  .superRefine((parameters, ctx) => {
    const nodes = parameters.reduce((n, p) => n * p.points, 1);
    if (nodes > FIT_MAX_POINTS) ctx.addIssue({ code: 'custom', path: [], message: `parameters make ${nodes} grid points; a fit may have at most ${FIT_MAX_POINTS}` });
    parameters.forEach((p, i) => {
      if (!(p.max > p.min)) ctx.addIssue({ code: 'custom', path: [i, 'max'], message: `parameters[${i}].max must be above min (${p.min}); got ${p.max}` });
      if ((p.scale === 'log' || p.prior === 'logUniform') && !(p.min > 0)) {
        ctx.addIssue({ code: 'custom', path: [i, 'min'], message: `parameters[${i}].min must be above 0 for a ${p.scale === 'log' ? 'log grid' : 'log-uniform prior'}; got ${p.min}` });
      }
      if (parameters.findIndex((q) => q.path === p.path) !== i) ctx.addIssue({ code: 'custom', path: [i, 'path'], message: `parameters[${i}].path repeats "${p.path}"` });
    });
  });

export const createFitBodySchema = z.strictObject({
  scenarioId: idSchema,
  /** A constraint set of the department, or "library" for every published constraint. */
  constraintSetId: z.union([idSchema, z.literal(LIBRARY_SET_ID)]),
  name: z.string().trim().min(1).max(160).optional(),
  parameters: parametersSchema,
  /** Systems per grid point (default: the scenario's). */
  systems: createRunBodySchema.shape.systems,
  seed: createRunBodySchema.shape.seed,
});
export type CreateFitBody = z.output<typeof createFitBodySchema>;

/** The command line's fit file (npm run fit -- fit.json). */
export const fitFileSchema = z.strictObject({
  scenario: z.record(z.string(), z.unknown()),
  constraints: z.array(constraintSchema).min(1, { error: 'constraints must hold at least one constraint' }),
  parameters: parametersSchema,
  systems: createRunBodySchema.shape.systems,
  seed: createRunBodySchema.shape.seed,
  workers: z.number().int().min(1).max(256).optional(),
});

export const fitStatusSchema = runStatusSchema;

const namedParameterSchema = z.object({ path: z.string(), label: z.string(), unit: z.string(), values: z.array(z.number()), scale: z.enum(['linear', 'log']), prior: z.enum(['uniform', 'logUniform']) });

export const fitPosteriorSchema = z.object({
  parameters: z.array(namedParameterSchema),
  /** ln L of the constraint set at every grid node, row-major (the last parameter varies fastest); null where it could not be scored. */
  logLikelihood: z.array(z.number().nullable()),
  marginals: z.array(z.object({ path: z.string(), values: z.array(z.number()), density: z.array(z.number()) })),
  intervals: z.array(
    z.object({
      path: z.string(),
      best: z.number(),
      lo68: z.number(),
      hi68: z.number(),
      lo95: z.number(),
      hi95: z.number(),
      /** The posterior is still ≥ 10% of its peak at the grid's lower (upper) edge: the interval is cut there by the grid, not by the data (false in fits stored before the flag existed). */
      lowerEdge: z.boolean().default(false),
      upperEdge: z.boolean().default(false),
      /** The same at an edge that is the parameter's own limit (e.g. a multiplier of 0): the posterior piles at the limit, so the result is in effect one-sided. */
      lowerLimit: z.boolean().default(false),
      upperLimit: z.boolean().default(false),
      /** The likelihood is flat along this parameter: the interval is the prior's. */
      flat: z.boolean().default(false),
    }),
  ),
  bestPoint: z.object({
    values: z.record(z.string(), z.number()),
    logLikelihood: z.number().nullable(),
    goodnessOfFit: z.object({ p: z.number().nullable(), sigma: z.number().nullable() }),
    /** The constraint set's scorecard at the best point. */
    evaluation: evaluationResponseSchema,
  }),
  /** Constraints whose Monte Carlo error is not negligible against the observed error at the best point. */
  mcLimited: z.array(z.string()),
  warnings: z.array(z.string()),
  /** A sentence a paper could use. */
  sentence: z.string(),
  method: z.string(),
});
export type FitPosterior = z.output<typeof fitPosteriorSchema>;

export const fitSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  status: fitStatusSchema,
  progress: z.number(),
  /** Chunks of the grid's one pass computed so far, of chunkCount (each chunk evaluates every grid point). */
  chunksDone: z.number(),
  chunkCount: z.number(),
  /** Seconds left while it computes, from the rate so far (null before two chunks are done). */
  etaSeconds: z.number().nullable(),
  createdAt: z.string(),
  scenarioName: z.string(),
  constraintSetName: z.string(),
  parameters: z.array(z.string()),
  /** Who queued it: they, or any modeller, may cancel it while it computes (null for `npm run fit`'s output, which has no owner). */
  ownerUserId: z.string().nullable(),
  /** Set when the fit answers an implied-occurrence question (its page is /implied-occurrence?fit=ID). */
  implied: impliedFitQuestionSchema.nullable(),
});
export type FitSummary = z.output<typeof fitSummarySchema>;
export const fitListResponseSchema = z.object({ fits: z.array(fitSummarySchema) });

export const fitDetailSchema = fitSummarySchema.extend({
  scenarioId: z.string().nullable(),
  scenarioVersion: z.number().nullable(),
  constraintSetId: z.string().nullable(),
  constraintSetVersion: z.number().nullable(),
  grid: z.array(fitParameterSchema.extend({ label: z.string(), unit: z.string() })),
  pointCount: z.number(),
  systems: z.number(),
  seed: z.string(),
  engineVersion: z.string(),
  costCredits: z.number().nullable(),
  /** The run that computes the grid in one pass (its own result is the first grid point's). */
  runId: z.string().nullable(),
  error: z.string().nullable(),
  finishedAt: z.string().nullable(),
  posterior: fitPosteriorSchema.nullable(),
  /** The methods paragraph (null until the fit has a posterior). */
  methods: z.string().nullable(),
});
export type FitDetail = z.output<typeof fitDetailSchema>;
