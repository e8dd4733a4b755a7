import { powerLawQuantile, powerLawQuantileTable } from './imf-power-law.ts';

/**
 * Inverse-CDF draws inside one companion row.
 *
 * Power law in ln x: dN ∝ x^a dln x on [lo, hi] (the form Cumming et al. 2008, PASP 120, 531,
 * fit to radial-velocity planets, dN ∝ M^α P^β dlnM dlnP with α = −0.31, β = 0.26). The CDF
 * is (x^a − lo^a)/(hi^a − lo^a), so x = (lo^a + u (hi^a − lo^a))^(1/a); for a = 0 the row is
 * log-uniform, x = lo (hi/lo)^u. Units follow the range (MJup, Msun, q, days).
 * Example: a = 0 on [10, 1000] with u = 0.5 gives 100.
 */
export function powerLawInLogSample(lo: number, hi: number, exponent: number, u: number): number {
  return powerLawQuantile(powerLawQuantileTable(lo, hi, exponent), u);
}

/**
 * Flat draw on [lo, hi] (the flat mass-ratio distribution of Raghavan et al. 2010, ApJS 190, 1,
 * Fig. 16, used with their log-normal periods). Example: [0.1, 1] with u = 0.5 gives 0.55.
 */
export function flatSample(lo: number, hi: number, u: number): number {
  return lo + u * (hi - lo);
}

/**
 * Log-normal period distribution truncated to [loDays, hiDays]: log10 P ~ N(μ, σ²) restricted to
 * the row, drawn as log10 P = μ + σ Φ⁻¹(Φ(zLo) + u [Φ(zHi) − Φ(zLo)]) with z = (log10 P − μ)/σ
 * (Raghavan et al. 2010: μ = 5.03, σ = 2.28 for solar-type stars; Duquennoy & Mayor 1991,
 * A&A 248, 485: μ = 4.8, σ = 2.3). The caller passes Φ(zLo) and Φ(zHi) − Φ(zLo), computed
 * once per scenario, and the quantile function.
 * Example: μ = 5.03, σ = 2.28, untruncated (cdfLo 0, cdfSpan 1), u = 0.5 gives 10^5.03 ≈ 107,000 d.
 */
export function truncatedLognormalPeriodDays(
  mean: number,
  sigma: number,
  cdfLo: number,
  cdfSpan: number,
  u: number,
  quantile: (p: number) => number,
): number {
  return Math.exp((mean + sigma * quantile(cdfLo + u * cdfSpan)) * Math.LN10); // 10^x without Math.pow's cost
}
