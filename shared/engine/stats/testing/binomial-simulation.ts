// Seeded binomial sampling for the statistical checks (coverage, size of a test): a decision
// per outcome k = 0 … n, its exact probability, and its frequency in simulated samples.
// Test code only.
import { chunkUniform } from '../../random.ts';
import { logBinomialPmf } from '../binomial-pmf.ts';

/** Σ P(X = k) over the outcomes k with chosen[k], X ~ Binomial(n, p). */
export function exactProbability(chosen: boolean[], n: number, p: number): number {
  return chosen.reduce((s, c, k) => s + (c ? Math.exp(logBinomialPmf(k, n, p)) : 0), 0);
}

/**
 * Frequency of chosen outcomes among `trials` seeded samples of Binomial(n, p), each drawn as n
 * Bernoulli trials from chunkUniform(seed, chunk), with the binomial standard error of a
 * frequency whose true value is `expected`: √(expected (1 − expected) / trials).
 */
export function simulatedFrequency(
  chosen: boolean[],
  n: number,
  p: number,
  trials: number,
  seed: string,
  expected: number,
  chunk = 0,
): { frequency: number; se: number } {
  const u = chunkUniform(seed, chunk);
  let hits = 0;
  for (let t = 0; t < trials; t++) {
    let k = 0;
    for (let i = 0; i < n; i++) if (u() < p) k++;
    if (chosen[k]) hits++;
  }
  return { frequency: hits / trials, se: Math.sqrt((expected * (1 - expected)) / trials) };
}
