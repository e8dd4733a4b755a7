import { z } from 'zod';
import type { OptionDeclaration, VariantSchema } from './method-option.ts';

/**
 * The published initial–final mass relations, each declared once: its schema variant (the
 * document's `primaries.ifmr`), its builder label and summary, its citations, the methods
 * paragraph's words, and its coefficients as straight-line pieces Mf = slope · Mi + intercept
 * (Msun), which the engine evaluates (shared/engine/physics/ifmr-piecewise.ts: the end pieces are
 * extended linearly and the result is capped below the Chandrasekhar mass). Adding a published
 * IFMR touches this file and its test only (DEVELOPERS.md, "Adding a published method").
 */

/** Straight-line pieces: piece i holds for loMsun[i] ≤ Mi < loMsun[i+1]; validMsun is the calibrated range. */
export interface LinearPieces {
  loMsun: number[];
  slope: number[];
  intercept: number[];
  validMsun: [number, number];
}

/** A published relation: its option declaration and the coefficients the engine evaluates for its parsed variant. */
export interface PublishedIfmr<S extends VariantSchema = VariantSchema> extends OptionDeclaration<S> {
  pieces(ifmr: z.output<S>): LinearPieces;
}

const publishedIfmr = <S extends VariantSchema>(declaration: PublishedIfmr<S>): PublishedIfmr<S> => declaration;

/** Cummings et al.'s two calibrations, with the builder's names for them. */
const CALIBRATION_LABELS = { mist: 'MIST-based', parsec: 'PARSEC-based' } as const;
type Calibration = keyof typeof CALIBRATION_LABELS;
const CALIBRATIONS = Object.keys(CALIBRATION_LABELS) as [Calibration, ...Calibration[]];
export const CALIBRATION_OPTIONS = CALIBRATIONS.map((value) => ({ value, label: CALIBRATION_LABELS[value] }));

/**
 * Cummings et al. (2018, ApJ 866, 21; equation numbers not checked) piecewise-linear IFMRs from
 * cluster white dwarfs, with progenitor masses from MIST or PARSEC isochrones:
 *   MIST:   0.080 Mi + 0.489 (0.83–2.85), 0.187 Mi + 0.184 (2.85–3.60), 0.107 Mi + 0.471 (3.60–7.20)
 *   PARSEC: 0.0873 Mi + 0.476 (0.87–2.80), 0.181 Mi + 0.210 (2.80–3.65), 0.0835 Mi + 0.565 (3.65–8.20)
 * Example (MIST): Mi = 3 gives 0.187 · 3 + 0.184 = 0.745 Msun.
 */
const CUMMINGS_2018: Record<Calibration, LinearPieces> = {
  mist: { loMsun: [0.83, 2.85, 3.6], slope: [0.08, 0.187, 0.107], intercept: [0.489, 0.184, 0.471], validMsun: [0.83, 7.2] },
  parsec: { loMsun: [0.87, 2.8, 3.65], slope: [0.0873, 0.181, 0.0835], intercept: [0.476, 0.21, 0.565], validMsun: [0.87, 8.2] },
};

/**
 * Kalirai et al. (2008, ApJ 676, 594; their linear fit) semi-empirical IFMR from cluster white dwarfs:
 * Mf = (0.109 ± 0.007) Mi + (0.394 ± 0.025) Msun, calibrated for Mi ≈ 1.16–6.5 Msun.
 * Example: Mi = 1.16 gives 0.52 Msun; Mi = 3 gives 0.721 Msun.
 */
const KALIRAI_2008: LinearPieces = { loMsun: [1.16], slope: [0.109], intercept: [0.394], validMsun: [1.16, 6.5] };

/** In the builder's order; IFMR_CHOICE (method-choices.ts) adds the user's table. */
export const PUBLISHED_IFMRS = [
  publishedIfmr({
    schema: z.strictObject({ relation: z.literal('cummings2018'), calibration: z.enum(CALIBRATIONS).default('mist') }),
    label: 'Cummings et al.',
    cites: ['cummings'],
    summary: 'Piecewise linear, calibrated on MIST or PARSEC isochrones.',
    words: (o) => `the ${o.calibration.toUpperCase()}-based piecewise-linear initial–final mass relation`,
    pieces: (o) => CUMMINGS_2018[o.calibration],
  }),
  publishedIfmr({
    schema: z.strictObject({ relation: z.literal('kalirai2008') }),
    label: 'Kalirai et al.',
    cites: ['kalirai'],
    summary: 'Mf = 0.109 Mi + 0.394 Msun (fitted over about 1.16–6.5 Msun).',
    words: () => 'the initial–final mass relation Mf = 0.109 Mi + 0.394 Msun',
    pieces: () => KALIRAI_2008,
  }),
] as const;

/** A parsed `primaries.ifmr` that names a published relation. */
export type PublishedIfmrOptions = z.output<(typeof PUBLISHED_IFMRS)[number]['schema']>;

/** The coefficients of a published relation chosen in a parsed document. */
export function publishedIfmrPieces(ifmr: PublishedIfmrOptions): LinearPieces {
  const declared = PUBLISHED_IFMRS.find((d) => d.schema.shape.relation.value === ifmr.relation) as PublishedIfmr | undefined;
  if (!declared) throw new Error(`primaries.ifmr.relation ${ifmr.relation} is not a published relation`);
  return declared.pieces(ifmr);
}
