import { OCCURRENCE_CSV_COLUMNS } from './occurrence-tables-api.ts';
import { companionRowSchema, type CompanionRow } from './occurrence-table.ts';
import { formatNumber, parseFields } from './field-issues.ts';

/**
 * One companion row as text cells: the columns of the occurrence-table CSV
 * (OCCURRENCE_CSV_COLUMNS) plus the host-mass slope, which the CSV does not carry; and the one
 * reader that turns such cells into a checked CompanionRow. The server's CSV upload and the
 * client's row editor (a stored table's rows, a scenario's inline rows) all read rows with it, so
 * a problem is named by the same column everywhere ("rows.3.occurrence", "companions.rows[3].occurrence"
 * and the CSV's line 5, column occurrence land in the same cell).
 */
export const ROW_CELL_COLUMNS = [...OCCURRENCE_CSV_COLUMNS, 'hostMassSlope'] as const;
export type CellColumn = (typeof ROW_CELL_COLUMNS)[number];
export type RowCells = Record<CellColumn, string>;

export const MASS_UNIT_KEYS = { MJup: 'massMJup', Msun: 'massMsun', q: 'massRatio' } as const;
export type MassUnit = keyof typeof MASS_UNIT_KEYS;

const NUMERIC: readonly CellColumn[] = [
  'massMin',
  'massMax',
  'periodMinDays',
  'periodMaxDays',
  'occurrence',
  'massSlope',
  'periodSlope',
  'meanLog10PeriodDays',
  'sigmaLog10Period',
  'hostMassSlope',
];

/** The row fields the cells hold; anything else a draft row carries is not theirs. */
export const CELL_ROW_KEYS = [
  'class',
  'massMJup',
  'massMsun',
  'massRatio',
  'periodDays',
  'occurrence',
  'hostMassSlope',
  'shape',
  'label',
  'source',
  'assumed',
] as const;

// 1e10 rather than 10000000000, so the cell shows the whole number; a missing or unreadable value is an empty cell.
const text = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? formatNumber(v) : '');
const word = (v: unknown) => (typeof v === 'string' ? v : '');
const pair = (v: unknown): readonly unknown[] => (Array.isArray(v) ? v : []);

/**
 * A row as text cells; readRowCells reads them back to the same row. Takes a stored row or a
 * scenario draft's row that may not be valid yet (missing or unreadable values give empty cells).
 */
export function cellsFromRow(row: CompanionRow | Readonly<Record<string, unknown>>): RowCells {
  const r = row as Readonly<Record<string, unknown>>;
  const unit = (Object.keys(MASS_UNIT_KEYS) as MassUnit[]).find((u) => r[MASS_UNIT_KEYS[u]] !== undefined) ?? 'MJup';
  const range = pair(r[MASS_UNIT_KEYS[unit]]);
  const shape = (r.shape ?? {}) as Readonly<Record<string, unknown>>;
  const kind = word(shape.kind);
  const parameter = (of: string, key: string) => (kind === of ? text(shape[key]) : '');
  return {
    class: word(r.class),
    massUnit: unit,
    massMin: text(range[0]),
    massMax: text(range[1]),
    periodMinDays: text(pair(r.periodDays)[0]),
    periodMaxDays: text(pair(r.periodDays)[1]),
    occurrence: text(r.occurrence),
    shape: kind,
    massSlope: parameter('powerlaw', 'massSlope'),
    periodSlope: parameter('powerlaw', 'periodSlope'),
    meanLog10PeriodDays: parameter('lognormalPeriod', 'meanLog10PeriodDays'),
    sigmaLog10Period: parameter('lognormalPeriod', 'sigmaLog10Period'),
    hostMassSlope: text(r.hostMassSlope),
    label: word(r.label),
    source: word(r.source),
    assumed: word(r.assumed),
  };
}

/** A schema path inside a row → the cell it came from. */
export function columnOfPath(path: readonly PropertyKey[]): CellColumn {
  const [first, second] = path;
  if (first === 'massMJup' || first === 'massMsun' || first === 'massRatio')
    return second === 1 ? 'massMax' : 'massMin';
  if (first === 'periodDays') return second === 1 ? 'periodMaxDays' : 'periodMinDays';
  if (first === 'shape') return second === 'kind' || second === undefined ? 'shape' : (second as CellColumn);
  if (first === undefined) return 'massUnit';
  return (ROW_CELL_COLUMNS as readonly string[]).includes(String(first)) ? (first as CellColumn) : 'class';
}

/** A cell → the path of its value inside a row (the inverse of columnOfPath); the unit cell has none of its own. */
export function pathOfColumn(column: CellColumn, massUnit: string): (string | number)[] {
  const massKey = MASS_UNIT_KEYS[massUnit as MassUnit] ?? 'massMJup';
  if (column === 'massMin' || column === 'massMax') return [massKey, column === 'massMax' ? 1 : 0];
  if (column === 'periodMinDays' || column === 'periodMaxDays')
    return ['periodDays', column === 'periodMaxDays' ? 1 : 0];
  if (column === 'shape') return ['shape', 'kind'];
  if (
    column === 'massSlope' ||
    column === 'periodSlope' ||
    column === 'meanLog10PeriodDays' ||
    column === 'sigmaLog10Period'
  )
    return ['shape', column];
  return [column];
}

/** "massMJup[1]" or "shape.massSlope" → its path parts. */
export function pathOfField(field: string): (string | number)[] {
  return field
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .filter(Boolean)
    .map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}

/**
 * A problem in one cell. `message` starts with `field` (the column, or the schema field the
 * message names, e.g. "massMJup[0]"), so each side can phrase it its own way.
 */
export interface RowCellProblem {
  column: CellColumn;
  field: string;
  message: string;
}

export type RowCellsCheck = { ok: true; row: CompanionRow } | { ok: false; problems: RowCellProblem[] };

/** Plain JavaScript number syntax: null for an empty cell, NaN for text that is not a finite number. */
function plainNumber(text: string): number | null {
  if (text === '') return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : Number.NaN;
}

type NumberReader = (text: string) => number | null;

/**
 * The row the cells describe, before any check: numbers read with `parseNumber` (an unreadable
 * one stays NaN, so that the schema names it), empty cells left out (the schema's defaults or its
 * "required" apply), an unknown unit read as Jupiter masses. A scenario draft holds its inline
 * rows in this form while they are typed.
 */
export function rowCandidate(
  cells: Partial<RowCells>,
  parseNumber: NumberReader = plainNumber,
): Record<string, unknown> {
  const cell = (column: CellColumn) => (cells[column] ?? '').trim();
  const number = (column: CellColumn) => parseNumber(cell(column)) ?? undefined;
  const shapeKind = cell('shape') || 'powerlaw';
  const parameters = (
    shapeKind === 'lognormalPeriod' ? ['meanLog10PeriodDays', 'sigmaLog10Period'] : ['massSlope', 'periodSlope']
  ) as CellColumn[];
  const candidate: Record<string, unknown> = {
    class: cell('class'),
    [MASS_UNIT_KEYS[cell('massUnit') as MassUnit] ?? 'massMJup']: [number('massMin'), number('massMax')],
    periodDays: [number('periodMinDays'), number('periodMaxDays')],
    occurrence: number('occurrence'),
    shape: Object.fromEntries(
      [['kind', shapeKind], ...parameters.map((p) => [p, number(p)])].filter(([, v]) => v !== undefined),
    ),
  };
  if (number('hostMassSlope') !== undefined) candidate.hostMassSlope = number('hostMassSlope');
  for (const column of ['label', 'source', 'assumed'] as const)
    if (cell(column) !== '') candidate[column] = cell(column);
  return candidate;
}

/**
 * Reads one row of cells (trimmed) with the shared row schema. `parseNumber` reads a numeric cell
 * (null when empty, NaN when not a number); the client passes its friendlier number-input reader.
 * A missing shape means a power law.
 */
export function readRowCells(cells: Partial<RowCells>, parseNumber: NumberReader = plainNumber): RowCellsCheck {
  const cell = (column: CellColumn) => (cells[column] ?? '').trim();
  const problems: RowCellProblem[] = [];
  for (const column of NUMERIC) {
    const raw = cell(column);
    if (Number.isNaN(parseNumber(raw)))
      problems.push({ column, field: column, message: `${column} must be a number (got "${raw}")` });
  }
  const unit = cell('massUnit');
  if (!MASS_UNIT_KEYS[unit as MassUnit])
    problems.push({
      column: 'massUnit',
      field: 'massUnit',
      message: `massUnit must be one of MJup, Msun, q (got "${unit}")`,
    });
  if (problems.length > 0) return { ok: false, problems };

  const parsed = parseFields(companionRowSchema, rowCandidate(cells, parseNumber));
  if (parsed.success) return { ok: true, row: parsed.data };
  return {
    ok: false,
    // A whole-row problem is named 'scenario'; it belongs to the mass columns' unit.
    problems: parsed.issues.map((issue) => ({
      column: columnOfPath(pathOfField(issue.field === 'scenario' ? '' : issue.field)),
      field: issue.field,
      message: issue.message,
    })),
  };
}
