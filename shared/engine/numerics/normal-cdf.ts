import { errorFunction } from 'simple-statistics';

/**
 * Standard normal distribution function Φ(x) = [1 + erf(x/√2)] / 2, with simple-statistics'
 * error function (the Chebyshev fit of Numerical Recipes' erfcc, Press et al. 1992 §6.2,
 * fractional error below 1.2e-7). Used only when a scenario is prepared (the truncation points
 * of a log-normal period distribution), never per system.
 * Example: standardNormalCdf(1.959964) ≈ 0.975.
 */
export function standardNormalCdf(x: number): number {
  return 0.5 * (1 + errorFunction(x / Math.SQRT2));
}
