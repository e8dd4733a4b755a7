import { z } from 'zod';
import { number } from './field-issues.ts';
import { SHAPE_CHOICE, unionOf } from './method-choices.ts';

/**
 * A companion occurrence row and a table of rows. A row is one class of companion with a mass
 * range in exactly one unit, a period range, the probability that a star hosts one companion
 * of the row (at most one per row; rows are independent) and the shape of the distribution
 * inside the row. `source` and `assumed` carry the row's provenance so that stored and
 * uploaded tables can say where their numbers come from.
 */

/** A closed range [lo, hi] whose ends lie in [min, max]; lo < hi is checked by the row. */
export const rangeSchema = (min: number, max: number) => z.tuple([number(min, max), number(min, max)]);

export const COMPANION_CLASSES = ['planet', 'brownDwarf', 'star'] as const;

/** A row's distribution shape: the options of SHAPE_CHOICE (method-choices.ts). */
export const companionShapeSchema = unionOf(SHAPE_CHOICE);

export const companionRowSchema = z
  .strictObject({
    class: z.enum(COMPANION_CLASSES),
    /** Companion mass range in Jupiter masses. */
    massMJup: rangeSchema(1e-3, 1000).optional(),
    /** Companion mass range in solar masses. */
    massMsun: rangeSchema(1e-6, 10).optional(),
    /** Mass-ratio range q = M2 / M1 (initial masses). */
    massRatio: rangeSchema(1e-6, 1).optional(),
    /** Initial orbital period range in days. */
    periodDays: rangeSchema(0.01, 1e12),
    /** Probability (0–1) that a star hosts one companion of this row, before the multiplier. */
    occurrence: number(0, 1),
    /**
     * Occurrence scales with the host's initial mass as occurrence × (M1 / 1 Msun)^hostMassSlope,
     * capped at 1 per star (0 = independent of the host). For giant planets the occurrence rises
     * with stellar mass (Johnson et al. 2010, PASP 122, 905, roughly ∝ M1 at fixed metallicity;
     * from memory: a pointer, not a fit). Absent means 0.
     */
    hostMassSlope: number(-3, 3).optional(),
    shape: companionShapeSchema.prefault({ kind: 'powerlaw' }),
    label: z.string().max(200).optional(),
    /** Where the row's numbers come from (paper, table). */
    source: z.string().max(2000).optional(),
    /** What was assumed where the source is silent. */
    assumed: z.string().max(2000).optional(),
  })
  .superRefine((row, ctx) => {
    const given = (['massMJup', 'massMsun', 'massRatio'] as const).filter((k) => row[k] !== undefined);
    if (given.length !== 1) {
      ctx.addIssue({
        code: 'custom',
        path: given.length === 0 ? [] : [given[1]],
        message: `must give exactly one mass range of massMJup, massMsun or massRatio (got ${given.length === 0 ? 'none' : given.join(' and ')})`,
      });
    }
    for (const key of ['massMJup', 'massMsun', 'massRatio', 'periodDays'] as const) {
      const range = row[key];
      if (range && !(range[0] < range[1])) {
        ctx.addIssue({ code: 'custom', path: [key], message: emptyRangeMessage(range) });
      }
    }
  });

export const occurrenceTableSchema = z.strictObject({
  title: z.string().max(200).optional(),
  description: z.string().max(4000).optional(),
  rows: z.array(companionRowSchema).max(32),
});

export type CompanionShape = z.output<typeof companionShapeSchema>;
export type CompanionRow = z.output<typeof companionRowSchema>;
export type OccurrenceTable = z.output<typeof occurrenceTableSchema>;

/** The tail of the message for an empty or inverted range. */
export function emptyRangeMessage(range: readonly [number, number]): string {
  return `must be a range [low, high] with low below high (got [${range[0]}, ${range[1]}])`;
}
