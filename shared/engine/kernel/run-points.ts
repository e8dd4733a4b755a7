import { z } from 'zod';
import { parseScenario, scenarioSchema, ScenarioValidationError, type Scenario } from '../../contracts/scenario.ts';
import { EngineError } from '../errors.ts';
import { prepareScenario, withDrawFreeValues, type PreparedScenario } from './prepare.ts';
import { preparedPoint, runChunkForPoints, type PreparedPoint } from './run-chunk.ts';
import type { ChunkTally } from './tally.ts';

/**
 * One pass, many parameter points: the kernel draws each system once and decides its fate at
 * every point (runChunkForPoints in run-chunk.ts; a single run is its one-point case).
 *
 * DRAW_FREE_PATHS are the scenario fields that leave every draw unchanged, checked against the
 * draw order of runChunk: the uniforms drawn per system and their count depend only on the
 * seed, the primaries (IMF, mass range, history, lifetimes), the IFMR (the white-dwarf test is
 * t_MS < age), whether the selection is magnitude-limited, whether the fossil channel is on,
 * the rows (occurrence, host-mass slope, shapes) and m_max = 1 / max(occurrence). So:
 * - companions.multiplier: a row is drawn iff u < occurrence · m_max; the multiplier only moves
 *   the presence threshold occurrence · multiplier below it;
 * - envelope.alpha, envelope.lambda: only the post-common-envelope orbit;
 * - disruption.eta, disruption.dissolution.massMJup (belowMass only): only the destroyed companion's
 *   fate and field;
 * - giant.reachAU: only the engulfment test a0 < reach. It exists only when giant.kind =
 *   "fixedReach"; for the track giant the reach comes from the track's grid, whose options
 *   (reimersEta, …) rebuild the grid and so are not draw-free: a caller that offers
 *   giant.reachAU must check giant.kind (preparePoints refuses it for a track scenario);
 * - field.*: thresholdMG, emergenceDelayGyr, and every numeric option of field.disruption (per its
 *   kind) and field.closeSurvivor: the field deviate z is drawn for every white dwarf whatever
 *   they are;
 * - channels.fossil.fraction and channels.fossil.msField.*: the two fossil uniforms are drawn
 *   for every white dwarf whenever the fossil channel is on.
 * Draw-free too but not offered here: the magnitude-limited selection's floor and wavelength
 * (every white dwarf's acceptance changes, so nothing is shared). Not draw-free: the age, IMF,
 * lifetimes, IFMR, rows, mass ranges, the track options, the seed and the system count; they
 * need one pass per value.
 */
export const DRAW_FREE_PATHS: readonly string[] = [
  'companions.multiplier',
  'envelope.alpha',
  'envelope.lambda',
  'disruption.eta',
  'disruption.dissolution.massMJup',
  'giant.reachAU',
  'field.thresholdMG',
  'field.emergenceDelayGyr',
  'field.disruption.medianMG',
  'field.disruption.widthDex',
  'field.disruption.referenceMG',
  'field.disruption.referenceMassMJup',
  'field.disruption.slope',
  'field.disruption.alpha',
  'field.disruption.aspectRatio',
  'field.disruption.discMassFraction',
  'field.closeSurvivor.medianMG',
  'field.closeSurvivor.widthDex',
  'field.closeSurvivor.maxPeriodDays',
  'channels.fossil.fraction',
  'channels.fossil.msField.medianKG',
  'channels.fossil.msField.widthDex',
];

const DRAW_FREE = new Set(DRAW_FREE_PATHS);

/**
 * true iff `path` is one of DRAW_FREE_PATHS. Some apply only to some scenarios: giant.reachAU
 * needs giant.kind = "fixedReach", field.disruption.medianMG the lognormal disruption field, and
 * so on (checking that is the caller's concern; preparePoints refuses a path the scenario does
 * not have).
 */
export function isDrawFreePath(path: string): boolean {
  return DRAW_FREE.has(path);
}

/** One parameter point: draw-free path → value. Paths left out keep the scenario's value. */
export type PointValues = Readonly<Record<string, number>>;

/** The points of one pass, as plain structured-clone-able data (sent to the workers once). */
export interface PreparedPoints {
  /** scenarioHash of the scenario the draws come from (prepared.scenarioHash). */
  baseScenarioHash: string;
  points: PreparedPoint[];
}

/**
 * Checks the points against the scenario and prepares them: every path must be draw-free and
 * present in this scenario, every value inside the contract's range (and the multiplier at most
 * 1 / the largest row occurrence). Each point's scenario is validated like any document and its
 * preparation derived from `prepared` (withDrawFreeValues: only the draw-free parts and the hash
 * are its own: well under a millisecond a point, where a full preparation takes ≈ 14 ms); the first and the
 * last point are also prepared in full and must agree (an internal check of DRAW_FREE_PATHS).
 * `prepared` must be prepareScenario(scenario) (a track grid is reused, not rebuilt). Memory: the
 * pass returns one tally (≈ 2,700 numbers) per point per chunk.
 */
export function preparePoints(scenario: Scenario, prepared: PreparedScenario, points: readonly PointValues[]): PreparedPoints {
  if (points.length === 0) throw new EngineError('points', [], 'at least one parameter point');
  const engulfmentGrid = prepared.giant.kind === 'track' ? prepared.giant.grid : undefined;
  const preparedPoints: PreparedPoint[] = [];
  const envelopeKeys = new Map<string, number>();
  const disruptionKeys = new Map<string, number>();
  const closeKeys = new Map<string, number>();
  points.forEach((values, i) => {
    const pointScenario = scenarioWith(scenario, values);
    const point = preparedPoint(withDrawFreeValues(prepared, pointScenario));
    if (i === 0 || i === points.length - 1) {
      const full = prepareScenario(pointScenario, { engulfmentGrid });
      assertSameDraws(prepared, full);
      if (JSON.stringify(preparedPoint(full)) !== JSON.stringify(point)) throw new Error('a point prepared from the shared draws differs from its full preparation (DRAW_FREE_PATHS is wrong)');
    }
    point.envelopeGroup = groupOf(envelopeKeys, JSON.stringify(point.envelope));
    point.disruptionFieldGroup = groupOf(disruptionKeys, JSON.stringify([point.disruption.eta, point.field.disruption]));
    point.closeFieldGroup = groupOf(closeKeys, JSON.stringify(point.field.closeSurvivor));
    preparedPoints.push(point);
  });
  return { baseScenarioHash: prepared.scenarioHash, points: preparedPoints };
}

/**
 * Runs chunk `chunkIndex` once for every point: tally p is exactly
 * runChunk(prepareScenario(scenario with point p's values), chunkIndex), scenarioHash included.
 */
export function runChunkPoints(prepared: PreparedScenario, points: PreparedPoints, chunkIndex: number): ChunkTally[] {
  if (points.baseScenarioHash !== prepared.scenarioHash) {
    throw new Error(`the points were prepared for scenario ${points.baseScenarioHash}, not ${prepared.scenarioHash}`);
  }
  return runChunkForPoints(prepared, points.points, chunkIndex);
}

/** The number of the first equal key (numbering a new one): points with equal values share work. */
function groupOf(keys: Map<string, number>, key: string): number {
  let group = keys.get(key);
  if (group === undefined) keys.set(key, (group = keys.size));
  return group;
}

/** The scenario with the point's values, validated like any scenario document. */
function scenarioWith(scenario: Scenario, values: PointValues): Scenario {
  const copy = structuredClone(scenario) as Record<string, unknown>;
  for (const [path, value] of Object.entries(values)) {
    if (!isDrawFreePath(path)) throw new EngineError(path, value, `of the draw-free parameters (${DRAW_FREE_PATHS.join(', ')})`);
    const keys = path.split('.');
    const parent = keys.slice(0, -1).reduce<unknown>((node, key) => (isRecord(node) ? node[key] : undefined), copy);
    const leaf = keys[keys.length - 1];
    const bounds = numberBoundsAt(keys, scenario);
    if (!isRecord(parent) || typeof parent[leaf] !== 'number' || !bounds) {
      throw new EngineError(path, value, `of the fields this scenario has (${path} does not apply to it${applicability(path, scenario)})`);
    }
    if (typeof value !== 'number' || !Number.isFinite(value) || value < bounds.min || value > bounds.max) {
      throw new EngineError(path, value, `[${bounds.min}, ${bounds.max}]`);
    }
    parent[leaf] = value;
  }
  try {
    return parseScenario(copy);
  } catch (error) {
    if (!(error instanceof ScenarioValidationError)) throw error;
    const issue = error.issues[0];
    throw new EngineError(issue.field, valueAt(copy, issue.field), issue.message);
  }
}

function applicability(path: string, scenario: Scenario): string {
  if (path === 'giant.reachAU') return `: giant.kind = ${scenario.giant.kind}`;
  if (path.startsWith('field.disruption.')) return `: field.disruption.kind = ${scenario.field.disruption.kind}`;
  if (path.startsWith('disruption.dissolution.')) return `: disruption.dissolution.kind = ${scenario.disruption.dissolution.kind}`;
  return '';
}

/** Throws unless the two preparations draw the same numbers (an internal check of DRAW_FREE_PATHS). */
function assertSameDraws(a: PreparedScenario, b: PreparedScenario): void {
  const draws = (p: PreparedScenario) =>
    JSON.stringify([p.seed, p.systems, p.multiplierMax, p.ageGyr, p.constantHistory, p.selection.kind, p.channels.fossil.enabled, p.rows.map((r) => r.drawThreshold), p.imf, p.ifmr, p.lifetime]);
  if (draws(a) !== draws(b)) throw new Error('a draw-free parameter changed the draws (DRAW_FREE_PATHS is wrong)');
}

/** The numeric bounds the scenario schema gives the field at `keys` (following this scenario's kinds), or null if no number lives there. */
function numberBoundsAt(keys: readonly string[], scenario: Scenario): { min: number; max: number } | null {
  let node: z.ZodType | undefined = scenarioSchema;
  let value: unknown = scenario;
  for (const key of keys) {
    node = pickOption(unwrap(node), value);
    if (!(node instanceof z.ZodObject)) return null;
    node = (node.shape as Record<string, z.ZodType | undefined>)[key];
    value = isRecord(value) ? value[key] : undefined;
    if (!node) return null;
  }
  const leaf = unwrap(node);
  if (!(leaf instanceof z.ZodNumber) || leaf.minValue === null || leaf.maxValue === null) return null;
  return { min: leaf.minValue, max: leaf.maxValue };
}

function unwrap(node: z.ZodType): z.ZodType {
  let n = node;
  while (n instanceof z.ZodDefault || n instanceof z.ZodPrefault || n instanceof z.ZodOptional) n = n.unwrap() as z.ZodType;
  return n;
}

/** The option of a discriminated union that the value takes; other schemas as they are. */
function pickOption(node: z.ZodType, value: unknown): z.ZodType | undefined {
  if (!(node instanceof z.ZodDiscriminatedUnion)) return node;
  const discriminator = node.def.discriminator;
  const kind = isRecord(value) ? value[discriminator] : undefined;
  return (node.options as z.ZodType[]).find((option) => {
    const literal = option instanceof z.ZodObject ? (option.shape as Record<string, z.ZodType>)[discriminator] : undefined;
    return literal instanceof z.ZodLiteral && literal.values.has(kind as never);
  });
}

function valueAt(root: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((node, key) => (isRecord(node) ? node[key] : undefined), root);
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null;
}

/** Points that share every value of the paths that are not draw-free: one pass of the kernel. */
export interface PointValueGroup {
  /** The values of paths that change the draws or the track grid (age, giant.reimersEta, …), set on the pass's scenario. */
  shared: PointValues;
  /** Each point's draw-free values, for preparePoints on the pass's scenario. */
  points: PointValues[];
  /** The index of each of these points in the caller's list. */
  indices: number[];
}

/**
 * Splits a list of points into passes: points that differ only in draw-free paths share one
 * pass; every distinct combination of the other values (a sweep over the age, say) gets its
 * own pass on the scenario with those values, still on the same seed (common random numbers).
 * Passes come in the order of their first point.
 */
export function splitPointValues(points: readonly PointValues[]): PointValueGroup[] {
  const groups = new Map<string, PointValueGroup>();
  points.forEach((values, index) => {
    const entries = Object.entries(values);
    const shared = Object.fromEntries(entries.filter(([path]) => !isDrawFreePath(path)).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
    const key = JSON.stringify(shared);
    let group = groups.get(key);
    if (!group) groups.set(key, (group = { shared, points: [], indices: [] }));
    group.points.push(Object.fromEntries(entries.filter(([path]) => isDrawFreePath(path))));
    group.indices.push(index);
  });
  return [...groups.values()];
}
