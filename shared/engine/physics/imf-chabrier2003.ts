/**
 * Chabrier (2003, PASP 115, 763, Table 1, single-star "disk" IMF), per unit log10 M:
 *   ξ(log M) = 0.158 exp[−(log M − log 0.079)² / (2 · 0.69²)]   for M ≤ 1 Msun,
 *   ξ(log M) = 4.43e-2 M^-1.3                                       for M > 1 Msun
 * (so dN/dM ∝ M^-2.3 above 1 Msun; the two forms meet at 1 Msun to within 0.5%).
 * Units: number per log10 M (unnormalised), M in Msun; valid for 0.01–100 Msun.
 * Example: ξ(log 1) = 0.158 exp(−1.1024²/0.9522) ≈ 0.0441.
 */
export const CHABRIER_2003 = {
  lognormal: { amplitude: 0.158, peakMsun: 0.079, sigmaDex: 0.69, upperMsun: 1 },
  powerLaw: { amplitude: 4.43e-2, slopePerLog: 1.3 },
} as const;

/** ξ(log M) of the log-normal part (M ≤ 1 Msun), per unit log10 M. */
export function chabrierLognormalPerLog(massMsun: number): number {
  const { amplitude, peakMsun, sigmaDex } = CHABRIER_2003.lognormal;
  const x = Math.log10(massMsun / peakMsun);
  return amplitude * Math.exp(-(x * x) / (2 * sigmaDex * sigmaDex));
}
