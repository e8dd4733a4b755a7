import { clopperPearson } from './clopper-pearson.ts';
import { formatPercentWithError, formatSignificant } from './format.ts';

/**
 * A Monte Carlo fraction k/n as text: "9.03% ± 0.09%" (the binomial standard error), or, when
 * no magnetic white dwarf was drawn (k = 0, where that error is 0 and says nothing), the upper
 * end of the central 95% Clopper–Pearson interval, 1 − 0.025^(1/n) (Clopper & Pearson 1934,
 * Biometrika 26, 404). Dimensionless counts, 0 ≤ k ≤ n; null when n = 0 (no fraction defined).
 * Example: fractionOrLimitText(0, 300000, 0) = "< 0.0012% (95% upper limit, none of 300,000)".
 */
export function fractionOrLimitText(k: number, n: number, se: number): string | null {
  if (!(n > 0)) return null;
  if (k === 0) {
    const { upper } = clopperPearson(0, n, 0.95);
    return `< ${formatSignificant(100 * upper, 2)}% (95% upper limit, none of ${n.toLocaleString('en-US')})`;
  }
  return formatPercentWithError(k / n, se);
}
