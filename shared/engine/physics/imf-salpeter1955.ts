/**
 * Salpeter (1955, ApJ 121, 161) initial mass function: dN/dM ∝ M^-2.35 (his ξ(log M) ∝ M^-1.35),
 * fitted to stars of 0.4–10 Msun; used here as a single power law over the scenario's range.
 * Example: the fraction of stars of 1–8 Msun that lie in 1–2 Msun is
 * (1 − 2^-1.35)/(1 − 8^-1.35) ≈ 0.647.
 */
export const SALPETER_1955 = { breaksMsun: [] as number[], slopes: [2.35] } as const;
