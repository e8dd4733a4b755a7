/**
 * A piecewise-linear initial–final mass relation: segment i is Mf = slope_i Mi + intercept_i
 * for loMsun_i ≤ Mi < loMsun_(i+1); below the first and above the last segment the end
 * segments are extended linearly (most published IFMRs are straight lines fitted over a
 * limited range, and the engine says when a scenario leaves it). The result is capped at
 * 1.38 Msun, just below the Chandrasekhar mass where Nauenberg's radius vanishes.
 * Units: Msun. Example: one segment 0.109 Mi + 0.394 gives Mf(3) = 0.721.
 */
export interface IfmrSegments {
  loMsun: number[];
  slope: number[];
  intercept: number[];
  /** The initial-mass range over which the source calibrated the relation. */
  validMsun: [number, number];
}

/** Heaviest white dwarf the engine makes (Msun). */
export const MAX_WHITE_DWARF_MSUN = 1.38;

export function finalMassMsun(ifmr: IfmrSegments, initialMsun: number): number {
  const lo = ifmr.loMsun;
  let i = lo.length - 1;
  while (i > 0 && initialMsun < lo[i]) i--;
  const mf = ifmr.slope[i] * initialMsun + ifmr.intercept[i];
  return mf < MAX_WHITE_DWARF_MSUN ? mf : MAX_WHITE_DWARF_MSUN;
}
