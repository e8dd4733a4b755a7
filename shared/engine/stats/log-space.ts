/**
 * Arithmetic on natural logs of probabilities, so that tails far below the smallest double
 * (e.g. 0 of 1e6 at p = 0.5, probability 10^−301030) keep their value.
 */

/**
 * ln(1 − e^l) for l ≤ 0 without cancellation: expm1 near 0, log1p far from it
 * (Mächler 2012, "Accurately Computing log(1 − exp(−|a|))", Rmpfr package vignette).
 * Example: log1mExp(ln 0.25) = ln 0.75.
 */
export function log1mExp(l: number): number {
  return l > -Math.LN2 ? Math.log(-Math.expm1(l)) : Math.log1p(-Math.exp(l));
}

/** ln(e^a + e^b), factoring out the larger term so nothing overflows; −∞ is the log of 0. */
export function logAddExp(a: number, b: number): number {
  const hi = Math.max(a, b);
  if (hi === -Infinity) return -Infinity;
  return hi + Math.log1p(Math.exp(Math.min(a, b) - hi));
}
