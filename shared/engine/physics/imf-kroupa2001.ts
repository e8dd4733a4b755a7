/**
 * Kroupa (2001, MNRAS 322, 231, eq. 2) initial mass function: dN/dM ∝ M^-α with
 * α = 0.3 (0.01–0.08 Msun), 1.3 (0.08–0.5 Msun) and 2.3 (above 0.5 Msun), continuous at the
 * breaks. Example: by number, the share of 0.08–8 Msun stars that lie above 1 Msun is ≈ 0.091
 * (integrate the three pieces).
 */
export const KROUPA_2001 = { breaksMsun: [0.08, 0.5], slopes: [0.3, 1.3, 2.3] } as const;
