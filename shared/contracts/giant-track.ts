import { z } from 'zod';
import { number } from './field-issues.ts';

/**
 * Options of the analytic giant-branch + AGB track (`giant.kind = "track"`).
 * The track's physics lives in shared/engine/physics/giant-track.ts and the engulfment grid in
 * shared/engine/physics/engulfment-grid.ts; this file only fixes the document's shape.
 * The track is for solar metallicity (Z = 0.02) and primaries of 0.8–8 Msun.
 */
export const giantTrackSchema = z.object({
  kind: z.literal('track'),
  /**
   * Reimers (1975) efficiency η of Ṁ = 4×10⁻¹³ η L R / M (Msun/yr, solar units), applied on the
   * red giant branch and the AGB; McDonald & Zijlstra (2015) find 0.477 ± 0.070 from globular
   * clusters.
   */
  reimersEta: number(0.05, 3).default(0.477),
  /**
   * Zero point Mc0 of Paczyński's (1970, Acta Astron. 20, 47) AGB core-mass–luminosity relation
   * L = 59250 (Mc − Mc0) Lsun: 0.522 Msun as the relation is usually quoted, 0.495 Msun in a later
   * recalibration (both values from memory). The AGB starts where the relation gives ≈ 300 Lsun.
   */
  agbZeroPointMsun: number(0.45, 0.55).default(0.522),
  /**
   * Late-AGB superwind that strips what is left of the envelope. On the AGB the wind is the
   * larger of Reimers and Blöcker; with `none` the envelope left when the core reaches the
   * IFMR mass is assumed to be lost at once (the orbit can no longer be engulfed then). The
   * superwind is timed so that the track's final core equals the IFMR mass: where the wind
   * would empty the envelope earlier, the AGB wind is scaled down at that primary mass until
   * it empties the envelope as the core reaches the IFMR mass (within 0.005 Msun).
   */
  superwind: z
    .discriminatedUnion('kind', [
      /** Blöcker (1995, A&A 297, 727) rate η_B · 4.83×10⁻⁹ M_ZAMS^−2.1 L^2.7 × (Reimers with η = 1), efficiency η_B. */
      z.object({ kind: z.literal('bloecker1995'), eta: number(0.001, 1).default(0.05) }),
      z.object({ kind: z.literal('none') }),
    ])
    .default({ kind: 'bloecker1995', eta: 0.05 }),
  /**
   * Equilibrium tide on the companion's orbit (Zahn 1977 as used by Villaver & Livio 2009 and
   * Mustill & Villaver 2012): (da/dt)/a = −(f/τ)(M_env/M) q(1+q)(R/a)^8 with
   * f = (9/2) min[1, (P/2τ)²] and τ = [M_env R²/(3L)]^(1/3). `none` leaves only the widening by
   * mass loss (a · M_total conserved).
   */
  tide: z
    .discriminatedUnion('kind', [
      z.object({ kind: z.literal('zahn1977') }),
      z.object({ kind: z.literal('none') }),
    ])
    .default({ kind: 'zahn1977' }),
});

export type GiantTrackOptions = z.output<typeof giantTrackSchema>;
