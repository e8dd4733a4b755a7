/**
 * Tidefield's pricing, in one place. A run costs one credit per 10^7 systems, rounded up
 * (so every run costs at least one credit); the monthly free allowance and the credit packs
 * are defined here too when billing is enabled.
 */
export const SYSTEMS_PER_CREDIT = 10_000_000;

export function runCostCredits(systems: number): number {
  return Math.max(1, Math.ceil(systems / SYSTEMS_PER_CREDIT));
}

/** Observers may start runs of at most this many systems; modellers and admins any size. */
export const OBSERVER_MAX_SYSTEMS = 1_000_000;
