import { describe, expect, it } from 'vitest';
// @ts-ignore -- jstat (dev dependency, the reference library) ships no type declarations
import jstat from 'jstat';
import { chunkUniform } from '../random.ts';
import { QUANTILE_TABLE_TOLERANCE, tableQuantile, tabulateQuantile } from './quantile-table.ts';

const { jStat } = jstat as { jStat: { normal: { cdf(x: number, m: number, s: number): number; inv(p: number, m: number, s: number): number } } };

/**
 * The tabulated inverse CDFs the kernel uses, against exact CDFs written here from their formulas
 * (jStat's normal CDF for the log-normal periods of Raghavan et al. 2010, ApJS 190, 1; the power
 * law in ln x of Cumming et al. 2008, PASP 120, 531, and the Kroupa 2001 slope 2.3): the largest
 * |F(x̃(u)) − u| over 2·10^5 random u and every cell edge must stay ≤ 1e-7. Why that is negligible:
 * it bounds the Kolmogorov distance between the drawn and the exact distribution, so any event
 * x ∈ [a, b] shifts by ≤ 2e-7 in probability, while the Monte Carlo standard error of a fraction p
 * from 10^9 systems is √(p(1 − p)/10^9): 9.5e-6 at p = 0.1, 3.2e-7 even at p = 10^-4.
 */
const powerLawInLog = (lo: number, hi: number, a: number) => ({
  log10Quantile: (u: number) => (a === 0 ? Math.log10(lo) + u * Math.log10(hi / lo) : Math.log10(lo ** a + u * (hi ** a - lo ** a)) / a),
  cdf: (log10x: number) => (a === 0 ? (log10x - Math.log10(lo)) / Math.log10(hi / lo) : (10 ** (a * log10x) - lo ** a) / (hi ** a - lo ** a)),
});

const lognormal = (mean: number, sigma: number, loDays: number, hiDays: number) => {
  const cLo = jStat.normal.cdf(Math.log10(loDays), mean, sigma);
  const cHi = jStat.normal.cdf(Math.log10(hiDays), mean, sigma);
  return {
    log10Quantile: (u: number) => jStat.normal.inv(cLo + u * (cHi - cLo), mean, sigma),
    cdf: (log10x: number) => (jStat.normal.cdf(log10x, mean, sigma) - cLo) / (cHi - cLo),
  };
};

const cases = {
  'IMF slope 2.3 on [0.8, 8] Msun (Kroupa 2001)': powerLawInLog(0.8, 8, -1.3),
  'IMF slope 2.35 on [0.5, 20] Msun (Salpeter 1955)': powerLawInLog(0.5, 20, -1.35),
  'planet periods P^0.26 on [2, 2000] d (Cumming et al. 2008)': powerLawInLog(2, 2000, 0.26),
  'planet masses M^-0.31 on [0.3, 10] MJup (Cumming et al. 2008)': powerLawInLog(0.3, 10, -0.31),
  'log-uniform on [0.01, 1e12] d': powerLawInLog(0.01, 1e12, 0),
  'log-normal periods 5.03 ± 2.28 dex on [1, 1e10] d (Raghavan et al. 2010)': lognormal(5.03, 2.28, 1, 1e10),
};

describe('tabulated inverse CDF', () => {
  for (const [name, { log10Quantile, cdf }] of Object.entries(cases)) {
    it(`${name}: |F(x̃(u)) − u| ≤ 1e-7`, () => {
      const table = tabulateQuantile(log10Quantile);
      expect(table, 'a table is built').not.toBeNull();
      const u = chunkUniform(`quantile-table ${name}`, 0);
      let worst = 0;
      const probe = (v: number) => {
        worst = Math.max(worst, Math.abs(cdf(tableQuantile(table!, v)) - v));
      };
      for (let i = 0; i < 200_000; i++) probe(u());
      for (let k = 0; k <= table!.cells; k++) probe(k / table!.cells);
      // A little above the build-time estimate only for the rounding of the reference CDF (≈ 1e-13).
      expect(worst).toBeLessThanOrEqual(QUANTILE_TABLE_TOLERANCE);
    });
  }

  it('gives no table when 16384 cells cannot meet the tolerance, so the exact quantile stays', () => {
    // x^3 over 14 decades, and Salpeter's slope over [0.1, 150] Msun (the top cell spans a factor of ~1.5 in mass).
    expect(tabulateQuantile(powerLawInLog(0.01, 1e12, 3).log10Quantile)).toBeNull();
    expect(tabulateQuantile(powerLawInLog(0.1, 150, -1.35).log10Quantile)).toBeNull();
  });
});
