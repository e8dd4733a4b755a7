/**
 * Tidefield's pricing, in one place (server, client and tests all read it from here).
 *
 * - Every department gets a free allowance of systems each calendar month (UTC), by default
 *   5 × 10^8 systems (the server's FREE_SYSTEMS_PER_MONTH changes it). It is used first and
 *   does not carry over: what is left at the end of a month lapses.
 * - Systems beyond the allowance cost one credit per 10^7 systems, rounded up per run, so a
 *   run of 1.2 × 10^8 systems with no allowance left costs 12 credits, and one of 10^3 costs 1.
 * - A run's cost is reserved when it is queued, kept when it succeeds, and given back (credits,
 *   and free systems of the same month) when it fails or is cancelled. A sweep reserves every
 *   grid point at once.
 * - Credit is bought in the packs below (one-off payments, no subscription). Prices are in the
 *   currency's minor unit (cents).
 */
export const SYSTEMS_PER_CREDIT = 10_000_000;

/** The default monthly free allowance per department (the server's FREE_SYSTEMS_PER_MONTH). */
export const DEFAULT_FREE_SYSTEMS_PER_MONTH = 500_000_000;

export interface RunQuote {
  systems: number;
  /** Systems covered by the month's free allowance. */
  freeSystemsUsed: number;
  /** Systems beyond the allowance, charged in credits. */
  billableSystems: number;
  credits: number;
}

/** What a run of `systems` costs when the department has `freeSystemsLeft` free systems this month. */
export function quoteRun(systems: number, freeSystemsLeft: number): RunQuote {
  if (!Number.isSafeInteger(systems) || systems < 0) throw new RangeError(`systems must be a whole number ≥ 0 (got ${systems})`);
  const freeSystemsUsed = Math.min(systems, Math.max(0, Math.floor(freeSystemsLeft)));
  const billableSystems = systems - freeSystemsUsed;
  return { systems, freeSystemsUsed, billableSystems, credits: Math.ceil(billableSystems / SYSTEMS_PER_CREDIT) };
}

/** The cost of a run when no free allowance is left (a scenario's list price). */
export function listPriceCredits(systems: number): number {
  return quoteRun(systems, 0).credits;
}

/** The month an allowance belongs to: "2026-03" (UTC). */
export function allowancePeriod(at: Date): string {
  return at.toISOString().slice(0, 7);
}

export interface CreditPack {
  id: string;
  name: string;
  credits: number;
  /** Price in the currency's minor unit (cents). */
  unitAmount: number;
  currency: 'eur';
  /** The payment service's price lookup key (the price is created there on first use). */
  lookupKey: string;
}

/** The credit packs on sale. Changing a price means a new lookup key (prices are immutable there). */
export const CREDIT_PACKS: readonly CreditPack[] = [
  { id: 'pack-100', name: 'Tidefield credit, 100', credits: 100, unitAmount: 2_000, currency: 'eur', lookupKey: 'tidefield_credit_100_eur_v1' },
  { id: 'pack-500', name: 'Tidefield credit, 500', credits: 500, unitAmount: 9_000, currency: 'eur', lookupKey: 'tidefield_credit_500_eur_v1' },
  { id: 'pack-2000', name: 'Tidefield credit, 2000', credits: 2_000, unitAmount: 32_000, currency: 'eur', lookupKey: 'tidefield_credit_2000_eur_v1' },
];

export function findPack(id: string): CreditPack | undefined {
  return CREDIT_PACKS.find((p) => p.id === id);
}

/** Observers may start runs of at most this many systems; modellers and admins any size. */
export const OBSERVER_MAX_SYSTEMS = 1_000_000;
