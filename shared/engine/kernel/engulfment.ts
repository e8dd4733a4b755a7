import type { Scenario } from '../../contracts/scenario.ts';
import { MJUP_MSUN } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { finalMassMsun } from '../physics/ifmr-piecewise.ts';
import {
  buildEngulfmentGrid,
  engulfmentGridKey,
  sharedEngulfmentGrid,
  type EngulfmentGrid,
  type SharedEngulfmentGrid,
  type EngulfmentGridInput,
} from '../physics/engulfment-grid.ts';
import { ifmrSegments, lightestWhiteDwarfProgenitorMsun, preparedLifetime, resolvedRows } from './scenario-physics.ts';

export type { EngulfmentGrid, EngulfmentGridInput, SharedEngulfmentGrid };

/** The `track` giant as the kernel sees it: the grid (tables on shared memory) and the key it is cached under. */
export interface PreparedTrack {
  kind: 'track';
  grid: SharedEngulfmentGrid;
  gridKey: string;
}

/** Grid nodes in primary and companion mass (a_crit is smooth in log M1 and log M2). */
const PRIMARY_NODES = 24;
const COMPANION_NODES = 16;
/** Primary-mass span the giant track covers (lighter stars do not leave the main sequence in a Hubble time). */
const TRACK_PRIMARY_MSUN: [number, number] = [0.8, 8];
/** Companion-mass span of the grid; masses outside are clamped to its edge. */
const TRACK_COMPANION_MSUN: [number, number] = [1e-4, 1];

/**
 * The grid the `track` giant needs for this scenario: primary nodes log-spaced over the
 * primaries that can be white dwarfs today (the lightest one at the oldest age up to the top of
 * the mass range, kept within 0.8–8 Msun), each with the IFMR's final mass, and companion nodes
 * log-spaced over the rows' companion masses (within 1e-4–1 Msun).
 */
export function engulfmentGridInputFor(scenario: Scenario): EngulfmentGridInput {
  if (scenario.giant.kind !== 'track') throw new EngineError('giant.kind', scenario.giant.kind, '"track" (only the track giant has an engulfment grid)');
  const p = scenario.primaries;
  const lightest = lightestWhiteDwarfProgenitorMsun(preparedLifetime(scenario), p.massRangeMsun, p.history.ageGyr) ?? p.massRangeMsun[0];
  const [trackLo, trackHi] = TRACK_PRIMARY_MSUN;
  const m1Lo = Math.min(Math.max(lightest, trackLo), trackHi * 0.99);
  const m1Hi = Math.min(Math.max(p.massRangeMsun[1], m1Lo * 1.01), trackHi);
  const primaryMassesMsun = logSpaced(m1Lo, m1Hi, PRIMARY_NODES);
  const ifmr = ifmrSegments(scenario);
  const finalCoreMassesMsun = primaryMassesMsun.map((m) => finalMassMsun(ifmr, m));

  let m2Lo = Infinity;
  let m2Hi = 0;
  for (const row of resolvedRows(scenario)) {
    const [lo, hi] = row.massRatio
      ? [row.massRatio[0] * m1Lo, row.massRatio[1] * m1Hi]
      : row.massMsun ?? [row.massMJup![0] * MJUP_MSUN, row.massMJup![1] * MJUP_MSUN];
    m2Lo = Math.min(m2Lo, lo);
    m2Hi = Math.max(m2Hi, hi);
  }
  const [compLo, compHi] = TRACK_COMPANION_MSUN;
  if (!(m2Hi > 0)) [m2Lo, m2Hi] = [1e-3, 0.5];
  m2Lo = Math.min(Math.max(m2Lo, compLo), compHi / 2);
  m2Hi = Math.min(Math.max(m2Hi, m2Lo * 2), compHi);
  return {
    primaryMassesMsun,
    finalCoreMassesMsun,
    companionMassesMsun: logSpaced(m2Lo, m2Hi, COMPANION_NODES),
    track: scenario.giant,
  };
}

/** The prepared `track` giant: the given grid (checked against this scenario's key) or a new one. */
export function buildTrackGiant(scenario: Scenario, grid?: EngulfmentGrid | SharedEngulfmentGrid): PreparedTrack {
  const input = engulfmentGridInputFor(scenario);
  const gridKey = engulfmentGridKey(input);
  if (grid && grid.key !== gridKey) throw new EngineError('engulfmentGrid.key', grid.key, `the key of this scenario's grid (${gridKey})`);
  return { kind: 'track', grid: sharedEngulfmentGrid(grid ?? buildEngulfmentGrid(input)), gridKey };
}

function logSpaced(lo: number, hi: number, n: number): number[] {
  const a = Math.log(lo);
  const step = (Math.log(hi) - a) / (n - 1);
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? hi : Math.exp(a + i * step)));
}
