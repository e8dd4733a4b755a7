/**
 * Natural log of Σ_i e^(logTerm(i)) over i = start, start + step, … up to `end` (step ±1), for
 * terms that do not increase away from `start` and form a log-concave sequence (binomial,
 * hypergeometric and Poisson probabilities do). Log-concavity makes each ratio r of successive
 * terms bound all later ratios, so the rest of the tail is at most term · r/(1 − r); the sum
 * stops once that bound is below 1e-17 of the total. Terms are scaled by the first one, so
 * tails far below the smallest double keep their value.
 * Example: for logTerm(i) = −i ln 2 from 1 to 60, the result is ln(1 − 2^−60) ≈ −8.7e-19.
 */
export function logConcaveTailSum(start: number, end: number, logTerm: (i: number) => number): number {
  const step = end >= start ? 1 : -1;
  const first = logTerm(start);
  if (first === -Infinity) return -Infinity;
  let sum = 1;
  let previous = first;
  for (let i = start + step; step > 0 ? i <= end : i >= end; i += step) {
    const current = logTerm(i);
    const relative = Math.exp(current - first);
    sum += relative;
    const ratio = Math.exp(current - previous);
    if (ratio < 1 && (relative * ratio) / (1 - ratio) <= 1e-17 * sum) break;
    previous = current;
  }
  return first + Math.log(sum);
}
