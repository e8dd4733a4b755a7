import { z } from 'zod';

/**
 * The result document of one run: integer counts (chunk sums, exact), fractions derived from
 * them with Monte Carlo standard errors, histograms, the exact response of the magnetic count to
 * the occurrence multiplier, and, when the scenario carries an observed sample, the comparison.
 */

const count = z.number().int().min(0);

/** A fraction k/n with its Monte Carlo standard error; null when n = 0. */
export const fractionSchema = z.object({
  value: z.number().min(0).max(1).nullable(),
  se: z.number().min(0).nullable(),
  k: count,
  n: count,
});

const settingCountsSchema = z.object({ whiteDwarfs: count, magnetic: count });
const bySettingSchema = <T extends z.ZodType>(item: T) => z.object({ single: item, wide: item, postCE: item });
/**
 * Engine 2's channels. Engine-1 documents (stored before engine 2) have `coreMerger` instead of
 * `closeSurvivor`: both are optional so that those documents still parse; an engine-2 document
 * always has `closeSurvivor` and never `coreMerger`.
 */
const byChannelSchema = <T extends z.ZodType>(item: T) =>
  z.object({ disruption: item, closeSurvivor: item.optional(), fossil: item, coreMerger: item.optional() });
const magneticSplitSchema = z.object({ magnetic: z.array(count), nonMagnetic: z.array(count) });

/** compareWithObserved's output (shared/engine/stats/compare-observed.ts). Unknown keys are dropped on parse. */
export const observedComparisonSchema = z.object({
  observed: z.object({
    magnetic: count,
    total: count,
    fraction: z.number(),
    interval68: z.tuple([z.number(), z.number()]),
    interval95: z.tuple([z.number(), z.number()]),
  }),
  predicted: z.object({ value: z.number(), se: z.number() }),
  pValue: z.number(),
  /**
   * Gaussian-equivalent significance. Infinite when the prediction is exactly 0 or 1 and the
   * data contradict it; JSON has no Infinity, so it arrives as null and means "infinitely many σ".
   */
  sigma: z.number().nullable(),
  predictedInside68: z.boolean(),
  predictedInside95: z.boolean(),
  mcErrorMatters: z.boolean(),
  summary: z.string(),
  method: z.string(),
});

/** impliedMultiplier's output (shared/engine/stats/implied-occurrence.ts). Unknown keys are dropped on parse. */
export const impliedOccurrenceSchema = z.object({
  interval68: z.tuple([z.number(), z.number()]).nullable(),
  interval95: z.tuple([z.number(), z.number()]).nullable(),
  bestFit: z.number(),
  curve: z.array(z.object({ multiplier: z.number(), fraction: z.number() })),
  summary: z.string(),
  method: z.string(),
});

export const methodEntrySchema = z.object({ topic: z.string(), method: z.string(), reference: z.string() });

export const scenarioResultSchema = z.object({
  engineVersion: z.string(),
  scenarioHash: z.string().regex(/^[0-9a-f]{64}$/),
  seed: z.string(),
  systems: count,
  chunkCount: count,
  /** Chunks summed into these counts; equals chunkCount for a finished run. */
  chunksCompleted: count,
  complete: z.boolean(),
  counts: z.object({
    /** Primaries drawn (equals systems for a finished run). */
    primaries: count,
    /** Primaries that are white dwarfs today, before selection. */
    whiteDwarfsFormed: count,
    /** White dwarfs in the (selected) sample. */
    whiteDwarfs: count,
    magnetic: count,
    byChannel: byChannelSchema(count),
    bySetting: bySettingSchema(settingCountsSchema),
    channelBySetting: byChannelSchema(bySettingSchema(count)),
    /** Companions present around sampled white dwarfs, by fate (`merged`: engine 1 only; `dissolved`: engine 2). */
    companionFates: z.object({ wide: count, postCE: count, disrupted: count, dissolved: count.optional(), merged: count.optional() }),
    /** Sampled white dwarfs with a helium core (envelope ejected on the red giant branch); absent in engine-1 documents. */
    heliumWhiteDwarfs: count.optional(),
  }),
  /** Magnetic / white dwarfs. */
  fraction: fractionSchema,
  /** Magnetic / white dwarfs within each setting. */
  fractionBySetting: bySettingSchema(fractionSchema),
  /** Magnetic white dwarfs of each channel / all white dwarfs. */
  fractionByChannel: byChannelSchema(fractionSchema),
  bins: z.object({
    wdMass: z.object({ edgesMsun: z.array(z.number()), magnetic: z.array(count), nonMagnetic: z.array(count) }),
    /** White-dwarf mass by setting, on the edges of wdMass (absent in engine-1 documents). */
    wdMassBySetting: z
      .object({ edgesMsun: z.array(z.number()), single: magneticSplitSchema, wide: magneticSplitSchema, postCE: magneticSplitSchema })
      .optional(),
    /** log10 cooling age (Gyr) of every sampled white dwarf, from 1 Myr to 14 Gyr (absent in engine-1 documents). */
    coolingAge: z.object({ edgesLog10Gyr: z.array(z.number()), magnetic: z.array(count), nonMagnetic: z.array(count) }).optional(),
    /**
     * log10 final orbital period (days) of the post-common-envelope companion of every white dwarf
     * in the post-CE setting, 0.01 to 10^4 d (absent in engine-1 documents).
     */
    postCommonEnvelopePeriod: z.object({ edgesLog10Days: z.array(z.number()), magnetic: z.array(count), nonMagnetic: z.array(count) }).optional(),
    logField: z.object({
      edgesLog10MG: z.array(z.number()),
      /** Every sampled white dwarf with a field, magnetic or below the threshold (all channels). */
      counts: z.array(count),
      thresholdMG: z.number(),
      /** The same split by the channel that made the field (absent in engine-1 documents). */
      byChannel: z.object({ disruption: z.array(count), closeSurvivor: z.array(count), fossil: z.array(count) }).optional(),
    }),
    fateMap: z.object({
      log10MassEdgesMsun: z.array(z.number()),
      log10PeriodEdgesDays: z.array(z.number()),
      /** Engine 2: wide, postCE, disrupted, dissolved; engine-1 documents have merged instead of dissolved. */
      fates: z.array(z.enum(['wide', 'postCE', 'disrupted', 'dissolved', 'merged'])),
      /** counts[fate][massBin][periodBin]. */
      counts: z.array(z.array(z.array(count))),
    }),
    survivorSeparation: z.object({ edgesLog10AU: z.array(z.number()), wide: z.array(count), postCE: z.array(count) }),
  }),
  /** magneticAt[j]: magnetic white dwarfs had the multiplier been multiplierEdges[j] (same draws). */
  multiplierResponse: z.object({
    whiteDwarfs: count,
    multiplierEdges: z.array(z.number()),
    magneticAt: z.array(count),
    runMultiplier: z.number(),
    method: z.string(),
  }),
  comparison: observedComparisonSchema.optional(),
  impliedOccurrence: impliedOccurrenceSchema.optional(),
  assumptions: z.array(z.string()),
  methods: z.array(methodEntrySchema),
});

export type ScenarioResult = z.output<typeof scenarioResultSchema>;
export type ResultFraction = z.output<typeof fractionSchema>;
export type MethodEntry = z.output<typeof methodEntrySchema>;
