// Exact rational arithmetic (BigInt) for the binomial and hypergeometric probabilities and the
// two-sided tests, written straight from their definitions. An independent check on the
// floating-point engine code: no logs, no continued fractions, no bisection. Test code only.

/** A non-negative rational num/den. */
export interface Rational {
  num: bigint;
  den: bigint;
}

const factorialCache: bigint[] = [1n];
function factorial(n: number): bigint {
  for (let i = factorialCache.length; i <= n; i++) factorialCache[i] = factorialCache[i - 1] * BigInt(i);
  return factorialCache[n];
}

export function choose(n: number, k: number): bigint {
  if (k < 0 || k > n) return 0n;
  return factorial(n) / (factorial(k) * factorial(n - k));
}

/** Nearest double to a rational (17 significant digits kept, any magnitude above 1e-300). */
export function toNumber(r: Rational): number {
  if (r.num === 0n) return 0;
  const shift = r.den.toString().length - r.num.toString().length + 20;
  const scaled = shift >= 0 ? (r.num * 10n ** BigInt(shift)) / r.den : r.num / (r.den * 10n ** BigInt(-shift));
  return Number(scaled) * 10 ** -shift;
}

/** Binomial pmf numerators C(n,k) a^k (b−a)^(n−k) over the common denominator b^n, for p = a/b. */
export function binomialNumerators(n: number, a: number, b: number): { nums: bigint[]; den: bigint } {
  const A = BigInt(a);
  const B = BigInt(b);
  const nums = Array.from({ length: n + 1 }, (_, k) => choose(n, k) * A ** BigInt(k) * (B - A) ** BigInt(n - k));
  return { nums, den: B ** BigInt(n) };
}

/**
 * Sum of the probabilities no larger than the observed one times (1 + 1e-7), the two-sided
 * rule of R's binom.test and fisher.test, over a full support given as numerators.
 */
export function twoSidedFromNumerators(nums: bigint[], observedIndex: number, den: bigint): Rational {
  const limit = nums[observedIndex] * 10_000_001n; // d_i · 1e7 ≤ d_obs · (1e7 + 1)
  let total = 0n;
  for (const d of nums) if (d * 10_000_000n <= limit) total += d;
  return { num: total, den };
}

/** Exact two-sided binomial p-value of k of n against p = a/b. */
export function exactBinomialTest(k: number, n: number, a: number, b: number): number {
  const { nums, den } = binomialNumerators(n, a, b);
  return Math.min(1, toNumber(twoSidedFromNumerators(nums, k, den)));
}

/** Exact P(X ≤ k) and P(X ≥ k) for every k = 0 … n, X ~ Binomial(n, a/b). */
export function exactBinomialTails(n: number, a: number, b: number): { lower: number[]; upper: number[] } {
  const { nums, den } = binomialNumerators(n, a, b);
  const lower: number[] = [];
  const upper: number[] = new Array(n + 1);
  let below = 0n;
  for (let k = 0; k <= n; k++) lower.push(toNumber({ num: (below += nums[k]), den }));
  let above = 0n;
  for (let k = n; k >= 0; k--) upper[k] = toNumber({ num: (above += nums[k]), den });
  return { lower, upper };
}

/** Exact two-sided Fisher p-value of the table [[k1, n1 − k1], [k2, n2 − k2]]. */
export function exactFisherTest(k1: number, n1: number, k2: number, n2: number): number {
  const marked = k1 + k2;
  const total = n1 + n2;
  const lo = Math.max(0, n1 - (total - marked));
  const hi = Math.min(n1, marked);
  const nums: bigint[] = [];
  for (let x = lo; x <= hi; x++) nums.push(choose(marked, x) * choose(total - marked, n1 - x));
  return Math.min(1, toNumber(twoSidedFromNumerators(nums, k1 - lo, choose(total, n1))));
}

/** |a/b − 1|, the relative difference the tests bound. */
export function relativeError(a: number, b: number): number {
  return Math.abs(a / b - 1);
}
