import { EngineError, requireInRange } from '../errors.ts';

/**
 * Input checks shared by the statistics module. Every check throws EngineError naming the
 * argument, the value and the allowed range (the engine's single policy for bad input), and
 * returns the value unchanged so it can be used inline.
 */

/** A count: a non-negative integer that doubles represent exactly (≤ 2^53 − 1). */
export function requireCount(parameter: string, value: number): number {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new EngineError(parameter, value, `integers 0 … ${Number.MAX_SAFE_INTEGER}`);
  }
  return value;
}

/** k successes out of n trials: n a positive integer, k an integer in [0, n]. */
export function requireSuccesses(kName: string, k: number, nName: string, n: number): void {
  if (!Number.isSafeInteger(n) || n < 1) {
    throw new EngineError(nName, n, `integers 1 … ${Number.MAX_SAFE_INTEGER}`);
  }
  if (!Number.isSafeInteger(k) || k < 0 || k > n) {
    throw new EngineError(kName, k, `integers 0 … ${n} (${nName} = ${n})`);
  }
}

/** A probability in the closed interval [0, 1]. */
export function requireProbability(parameter: string, value: number): number {
  return requireInRange(parameter, value, 0, 1);
}

/** A confidence level (or any probability that must exclude 0 and 1): the open interval (0, 1). */
export function requireOpenUnit(parameter: string, value: number): number {
  if (!Number.isFinite(value) || value <= 0 || value >= 1) {
    throw new EngineError(parameter, value, '(0, 1) exclusive');
  }
  return value;
}
