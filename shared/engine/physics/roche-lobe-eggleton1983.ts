import { requireInRange } from '../errors.ts';

/**
 * Volume-equivalent Roche-lobe radius in units of the separation (Eggleton 1983, ApJ 268, 368,
 * eq. 2, equation number from memory): r_L/a = 0.49 q^(2/3) / [0.6 q^(2/3) + ln(1 + q^(1/3))], q = M_star / M_other for the
 * star whose lobe is wanted; better than 1% for all 0 < q < ∞.
 * Example: q = 1 gives 0.3789; q = 0.1 gives 0.2068.
 */
export function rocheLobeFraction(q: number): number {
  requireInRange('q', q, 1e-12, 1e12);
  const q13 = Math.cbrt(q);
  const q23 = q13 * q13;
  return (0.49 * q23) / (0.6 * q23 + Math.log1p(q13));
}
