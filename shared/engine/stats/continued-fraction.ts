/**
 * Value of the continued fraction f = b0 + a1/(b1 + a2/(b2 + a3/(b3 + …))) by the modified
 * Lentz method (Lentz 1976, Applied Optics 15, 668; modification of Thompson & Barnett 1986,
 * J. Comput. Phys. 64, 490; as given in Press et al. 2007, Numerical Recipes 3rd ed., §5.2).
 * Dimensionless. Stops when a step changes f by less than one ulp (relative 2.2e-16); throws
 * if that takes more than `maxTerms` terms (a numerical failure, not bad input).
 * Example: b0 = 1, a_j = b_j = 1 gives the golden ratio 1.6180339887498949.
 */
export function continuedFraction(
  b0: number,
  partialNumerator: (j: number) => number,
  partialDenominator: (j: number) => number,
  maxTerms: number,
): number {
  // Lentz replaces an exact zero by a tiny number so that no ratio becomes 0/0.
  const tiny = 1e-300;
  let f = b0 === 0 ? tiny : b0;
  let c = f;
  let d = 0;
  for (let j = 1; j <= maxTerms; j++) {
    const a = partialNumerator(j);
    const b = partialDenominator(j);
    d = b + a * d;
    if (d === 0) d = tiny;
    c = b + a / c;
    if (c === 0) c = tiny;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) <= Number.EPSILON) return f;
  }
  throw new Error(`continued fraction did not converge in ${maxTerms} terms`);
}
