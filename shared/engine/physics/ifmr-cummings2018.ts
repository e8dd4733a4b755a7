import type { IfmrSegments } from './ifmr-piecewise.ts';

/**
 * Cummings et al. (2018, ApJ 866, 21; equation numbers not checked) piecewise-linear IFMRs from cluster white
 * dwarfs, with progenitor masses from MIST or PARSEC isochrones. Units: Msun.
 *   MIST:   0.080 Mi + 0.489 (0.83–2.85), 0.187 Mi + 0.184 (2.85–3.60), 0.107 Mi + 0.471 (3.60–7.20)
 *   PARSEC: 0.0873 Mi + 0.476 (0.87–2.80), 0.181 Mi + 0.210 (2.80–3.65), 0.0835 Mi + 0.565 (3.65–8.20)
 * Example (MIST): Mi = 3 gives 0.187 · 3 + 0.184 = 0.745 Msun.
 */
export const CUMMINGS_2018: Record<'mist' | 'parsec', IfmrSegments> = {
  mist: { loMsun: [0.83, 2.85, 3.6], slope: [0.08, 0.187, 0.107], intercept: [0.489, 0.184, 0.471], validMsun: [0.83, 7.2] },
  parsec: { loMsun: [0.87, 2.8, 3.65], slope: [0.0873, 0.181, 0.0835], intercept: [0.476, 0.21, 0.565], validMsun: [0.87, 8.2] },
};
