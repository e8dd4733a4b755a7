import type { CompanionRow } from '../../contracts/occurrence-table.ts';
import type { IfmrOptions, LifetimeOptions, Scenario } from '../../contracts/scenario.ts';
import { byOption, type ByOption } from '../../contracts/method-option.ts';
import { EngineError } from '../errors.ts';
import { PUBLISHED_IFMRS, publishedIfmrPieces, type PublishedIfmrOptions } from '../../contracts/ifmr-relations.ts';
import { finalMassMsun, type IfmrSegments } from '../physics/ifmr-piecewise.ts';
import { ifmrFromTable } from '../physics/ifmr-table.ts';
import { scalingLifetimeAtLog10MassGyr, scalingLifetimeGyr } from '../physics/lifetime-scaling.ts';
import { tabulatedLifetimeAtLog10MassGyr, tabulatedLifetimeGyr } from '../physics/lifetime-table.ts';

/** Scenario-level physics shared by preparation and the engulfment grid: IFMR, lifetimes, rows. */

export type PreparedLifetime =
  | { kind: 'scaling'; t0Gyr: number; exponent: number }
  | { kind: 'table'; log10Mass: number[]; log10Gyr: number[] };

/** The scenario's inline rows; a stored table must have been resolved to rows before a run. */
export function resolvedRows(scenario: Scenario): CompanionRow[] {
  const rows = scenario.companions.rows;
  if (rows === undefined) {
    throw new EngineError('companions.tableId', scenario.companions.tableId, 'resolved to inline rows before a run (the server or CLI replaces a stored table reference by its rows)');
  }
  return rows;
}

/**
 * The scenario's IFMR as piecewise-linear segments: a user table, or a published relation's
 * coefficients from its declaration (shared/contracts/ifmr-relations.ts, where every published
 * relation must declare its `pieces`).
 */
const ifmrSegmentsOf = byOption<IfmrOptions, 'relation', IfmrSegments>('relation', {
  table: (ifmr) => ifmrFromTable(ifmr.points),
  ...(Object.fromEntries(PUBLISHED_IFMRS.map((d) => [d.schema.shape.relation.value, publishedIfmrPieces])) as ByOption<PublishedIfmrOptions, 'relation', IfmrSegments>),
});

export const ifmrSegments = (scenario: Scenario): IfmrSegments => ifmrSegmentsOf(scenario.primaries.ifmr);

const preparedLifetimeOf = byOption<LifetimeOptions, 'kind', PreparedLifetime>('kind', {
  scaling: (lifetime) => ({ kind: 'scaling', t0Gyr: lifetime.t0Gyr, exponent: lifetime.exponent }),
  table: (lifetime) => ({
    kind: 'table',
    log10Mass: lifetime.points.map((pt) => Math.log10(pt.massMsun)),
    log10Gyr: lifetime.points.map((pt) => Math.log10(pt.lifetimeGyr)),
  }),
});

export const preparedLifetime = (scenario: Scenario): PreparedLifetime => preparedLifetimeOf(scenario.primaries.lifetime);

/** Main-sequence lifetime (Gyr) under the prepared relation. */
export function lifetimeGyr(lifetime: PreparedLifetime, massMsun: number): number {
  return lifetime.kind === 'scaling'
    ? scalingLifetimeGyr(massMsun, lifetime.t0Gyr, lifetime.exponent)
    : tabulatedLifetimeGyr(massMsun, lifetime.log10Mass, lifetime.log10Gyr);
}

/** Main-sequence lifetime (Gyr) under the prepared relation at log10(M/Msun) (the kernel's form). */
export function lifetimeAtLog10MassGyr(lifetime: PreparedLifetime, log10MassMsun: number): number {
  return lifetime.kind === 'scaling'
    ? scalingLifetimeAtLog10MassGyr(log10MassMsun, lifetime.t0Gyr, lifetime.exponent)
    : tabulatedLifetimeAtLog10MassGyr(log10MassMsun, lifetime.log10Mass, lifetime.log10Gyr);
}

/**
 * The lightest primary in the scenario's mass range that can be a white dwarf today (the
 * turn-off mass at the oldest age), or null if none can. Lifetimes fall with mass, so bisect.
 */
export function lightestWhiteDwarfProgenitorMsun(lifetime: PreparedLifetime, massRangeMsun: readonly [number, number], maxAgeGyr: number): number | null {
  const [lo, hi] = massRangeMsun;
  if (!(lifetimeGyr(lifetime, hi) < maxAgeGyr)) return null;
  if (lifetimeGyr(lifetime, lo) < maxAgeGyr) return lo;
  let a = lo;
  let b = hi;
  for (let i = 0; i < 100; i++) {
    const mid = 0.5 * (a + b);
    if (lifetimeGyr(lifetime, mid) < maxAgeGyr) b = mid;
    else a = mid;
  }
  return b;
}

/** Largest white-dwarf mass over [lo, hi] (the IFMR is piecewise linear: check ends and knots). */
export function heaviestWhiteDwarfMsun(ifmr: IfmrSegments, loMsun: number, hiMsun: number): number {
  const candidates = [loMsun, hiMsun, ...ifmr.loMsun.filter((m) => m > loMsun && m < hiMsun)];
  return Math.max(...candidates.map((m) => finalMassMsun(ifmr, m)));
}


/** The largest multiplier the rows allow, 1 / max(occurrence); 1 when no row has any occurrence. */
export function multiplierMaxFor(rows: readonly { occurrence: number }[]): number {
  const maxOccurrence = rows.reduce((m, r) => Math.max(m, r.occurrence), 0);
  return maxOccurrence > 0 ? 1 / maxOccurrence : 1;
}
