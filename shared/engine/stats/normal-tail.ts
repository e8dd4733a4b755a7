import { continuedFraction } from './continued-fraction.ts';
import { log1mExp } from './log-space.ts';

const LN_HALF = -Math.LN2;
const LN_SQRT_PI = 0.5 * Math.log(Math.PI);
const SQRT_PI = Math.sqrt(Math.PI);

/**
 * Natural log of the standard normal upper tail, ln Q(z) = ln P(Z > z), accurate far into the
 * tail (relative error of Q ~1e-15 at any z; ln Q(40) = −804.6 where Q itself underflows).
 * Method: Q(z) = ½ erfc(z/√2) and erfc(x) = Γ(½, x²)/Γ(½) (Abramowitz & Stegun 1964, eq. 6.5.17),
 * with the regularised incomplete gamma function from its series (x² < 3/2) or its continued
 * fraction by Lentz's method (otherwise), as in Press et al. 1992, Numerical Recipes in C, 2nd ed.,
 * §6.2 (gser, gcf). No tabulated coefficients, so nothing to mistype.
 * Valid for all z, with ln Q(+∞) = −∞ and ln Q(−∞) = 0.
 * Example: logNormalUpperTail(5) = ln 2.866515718791939e-7 = −15.064998393988725.
 */
export function logNormalUpperTail(z: number): number {
  if (Number.isNaN(z)) throw new Error('logNormalUpperTail: z is NaN');
  if (z < 0) return log1mExp(logNormalUpperTail(-z));
  if (z === Infinity) return -Infinity;
  const s = 0.5 * z * z; // Q(z) = ½ Q_Γ(½, s)
  if (s < 1.5) {
    // Series P_Γ(a, s) = e^(−s) s^a / Γ(a+1) · Σ s^n / ((a+1)…(a+n)), with a = ½, Γ(3/2) = √π/2.
    let term = 1;
    let sum = 1;
    for (let n = 1; n < 200 && term > sum * Number.EPSILON; n++) {
      term *= s / (0.5 + n);
      sum += term;
    }
    const lowerGamma = (Math.exp(-s) * Math.sqrt(s) * sum) / (0.5 * SQRT_PI);
    return LN_HALF + Math.log1p(-lowerGamma);
  }
  // Q_Γ(a, s) = e^(−s) s^a / Γ(a) · 1/(s + 1 − a − 1(1 − a)/(s + 3 − a − 2(2 − a)/(s + 5 − a − …))).
  const g = continuedFraction(
    s + 0.5,
    (j) => -j * (j - 0.5),
    (j) => s + 2 * j + 0.5,
    1000,
  );
  return LN_HALF - s + 0.5 * Math.log(s) - LN_SQRT_PI - Math.log(g);
}
