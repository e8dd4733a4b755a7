import { z } from 'zod';
import { idSchema } from './common.ts';
import { impliedOccurrenceSchema } from './result.ts';
import { createRunBodySchema, runStatusSchema } from './runs.ts';

/**
 * Implied occurrence: "what multiple of the scenario's companion occurrence does my count allow?"
 * It is the one-parameter fit over `companions.multiplier` (shared/contracts/fits.ts) with the
 * sample's magnetic count as its single constraint, and it answers twice, with two different
 * quantities that are labelled for what they are:
 * - the confidence range: the multipliers an exact two-sided binomial test of the count does not
 *   reject (the test inverted, a frequentist range; from the run's exact multiplier response);
 * - the credible interval: the central interval of the fit's posterior over m, with its prior.
 * For a count of moderate size the two are close but not equal.
 */

/** POST /api/implied-occurrence. */
export const impliedOccurrenceBodySchema = z.strictObject({
  scenarioId: idSchema,
  sampleId: idSchema,
  systems: createRunBodySchema.shape.systems,
  seed: createRunBodySchema.shape.seed,
});
export type ImpliedOccurrenceBody = z.output<typeof impliedOccurrenceBodySchema>;

/** Answer of POST /api/implied-occurrence: the fit, the run computing it (as before) and the sample. */
export const impliedOccurrenceStartedSchema = z.object({ fitId: z.string(), runId: z.string(), sampleId: z.string() });

/**
 * The fit's grid over m: 0 … the largest multiplier the occurrence table allows (no row's
 * occurrence × m above 1), on 129 nodes. 129 = 256/2 + 1 puts every node on every other edge of
 * the run's exact 256-bin multiplier response (shared/engine/kernel/bins.ts), so the fit's
 * predicted fraction at each node is the response's own value there; the spacing (4.35/128 ≈ 0.034
 * for the baseline table) is about a twentieth of the 68% width of a sample of ~100 white dwarfs.
 */
export const IMPLIED_GRID_POINTS = 129;
/** The fit's prior on m, stated with every answer. */
export const IMPLIED_PRIOR = 'uniform' as const;

export const IMPLIED_CONFIDENCE_LABEL = 'Confidence range (exact binomial test inverted)';
export const IMPLIED_CREDIBLE_LABEL = 'Credible interval (posterior of the fit, uniform prior on m)';
export const IMPLIED_DIFFERENCE =
  'The confidence range holds the multipliers whose predicted fraction an exact two-sided binomial test of the count does not reject; ' +
  'the credible interval holds the central 68% (95%) of the posterior probability of m under a uniform prior. ' +
  'They answer different questions, so they are close but need not agree.';

/** What an implied-occurrence fit was asked for (stored with the fit). */
export const impliedFitQuestionSchema = z.object({
  sample: z.object({ id: z.string(), name: z.string(), magnetic: z.number(), total: z.number() }),
  /** The scenario's own multiplier (the fit's grid replaces it). */
  scenarioMultiplier: z.number(),
});
export type ImpliedFitQuestion = z.output<typeof impliedFitQuestionSchema>;

export const impliedConfidenceSchema = impliedOccurrenceSchema.extend({
  kind: z.literal('testInversion'),
  label: z.string(),
});

export const impliedCredibleSchema = z.object({
  kind: z.literal('posterior'),
  label: z.string(),
  prior: z.literal(IMPLIED_PRIOR),
  /** The prior in words, e.g. "uniform in m from 0 to 4.35". */
  priorText: z.string(),
  grid: z.object({ min: z.number(), max: z.number(), points: z.number() }),
  /** The marginal posterior's highest grid node. */
  peak: z.number(),
  interval68: z.tuple([z.number(), z.number()]),
  interval95: z.tuple([z.number(), z.number()]),
  marginal: z.object({ values: z.array(z.number()), density: z.array(z.number()) }),
  warnings: z.array(z.string()),
  summary: z.string(),
  method: z.string(),
});
export type ImpliedCredible = z.output<typeof impliedCredibleSchema>;

/** GET /api/implied-occurrence/:fitId — progress, then both answers side by side. */
export const impliedOccurrenceAnswerSchema = z.object({
  fitId: z.string(),
  runId: z.string(),
  /** Who asked: they, or any modeller, may cancel the fit while it computes. */
  ownerUserId: z.string().nullable(),
  status: runStatusSchema,
  progress: z.number(),
  error: z.string().nullable(),
  scenarioId: z.string().nullable(),
  scenarioName: z.string(),
  scenarioVersion: z.number().nullable(),
  systems: z.number(),
  seed: z.string(),
  engineVersion: z.string(),
  pointCount: z.number(),
  costCredits: z.number().nullable(),
  sample: impliedFitQuestionSchema.shape.sample,
  scenarioMultiplier: z.number(),
  /** White dwarfs of the run (the same at every m); null until it has finished. */
  whiteDwarfs: z.number().nullable(),
  /** Null until the run has finished. */
  confidence: impliedConfidenceSchema.nullable(),
  /** Null until the fit's posterior is stored. */
  credible: impliedCredibleSchema.nullable(),
  /** How the two differ, in one paragraph. */
  difference: z.string(),
  /** The methods text: both answers labelled, then the fit's own methods paragraph (null until finished). */
  methods: z.string().nullable(),
});
export type ImpliedOccurrenceAnswer = z.output<typeof impliedOccurrenceAnswerSchema>;
