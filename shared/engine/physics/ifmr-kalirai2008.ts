import type { IfmrSegments } from './ifmr-piecewise.ts';

/**
 * Kalirai et al. (2008, ApJ 676, 594; their linear fit) semi-empirical IFMR from cluster white dwarfs:
 * Mf = (0.109 ± 0.007) Mi + (0.394 ± 0.025) Msun, calibrated for Mi ≈ 1.16–6.5 Msun.
 * Example: Mi = 1.16 gives 0.52 Msun; Mi = 3 gives 0.721 Msun.
 */
export const KALIRAI_2008: IfmrSegments = {
  loMsun: [1.16],
  slope: [0.109],
  intercept: [0.394],
  validMsun: [1.16, 6.5],
};
