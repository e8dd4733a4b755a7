import { z } from 'zod';

/**
 * Options of the analytic giant-branch + AGB track (`giant.kind = "track"`).
 * The track's physics lives in shared/engine/physics/giant-track.ts and the engulfment grid in
 * shared/engine/physics/engulfment-grid.ts; this file only fixes the document's shape.
 */
export const giantTrackSchema = z.object({
  kind: z.literal('track'),
  /** Reimers (1975) efficiency η; McDonald & Zijlstra (2015) find 0.477 ± 0.070 from globular clusters. */
  reimersEta: z.number().min(0.05).max(3).default(0.477),
  /** Late-AGB superwind that strips what is left of the envelope. */
  superwind: z
    .discriminatedUnion('kind', [
      /** Blöcker (1995, A&A 297, 727) luminosity-dependent AGB rate with its efficiency η_B. */
      z.object({ kind: z.literal('bloecker1995'), eta: z.number().min(0.001).max(1).default(0.05) }),
      z.object({ kind: z.literal('none') }),
    ])
    .default({ kind: 'bloecker1995', eta: 0.05 }),
  /** Equilibrium tide on the companion's orbit (Zahn 1977 as used by Villaver & Livio 2009). */
  tide: z
    .discriminatedUnion('kind', [
      z.object({ kind: z.literal('zahn1977') }),
      z.object({ kind: z.literal('none') }),
    ])
    .default({ kind: 'zahn1977' }),
});

export type GiantTrackOptions = z.output<typeof giantTrackSchema>;
