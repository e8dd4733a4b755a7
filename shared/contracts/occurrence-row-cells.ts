import { OCCURRENCE_CSV_COLUMNS } from './occurrence-tables-api.ts';
import { companionRowSchema, type CompanionRow } from './occurrence-table.ts';
import { formatNumber, parseFields } from './field-issues.ts';

/**
 * One companion row as the text cells of the occurrence-table CSV (OCCURRENCE_CSV_COLUMNS), and
 * the one reader that turns such cells into a checked CompanionRow. The server's CSV upload and
 * the client's row editor both read rows with it, so a problem is named by the same column on
 * both sides ("rows.3.occurrence" and the CSV's line 5, column occurrence land in the same cell).
 */
export type CellColumn = (typeof OCCURRENCE_CSV_COLUMNS)[number];
export type RowCells = Record<CellColumn, string>;

export const MASS_UNIT_KEYS = { MJup: 'massMJup', Msun: 'massMsun', q: 'massRatio' } as const;
export type MassUnit = keyof typeof MASS_UNIT_KEYS;

const NUMERIC: readonly CellColumn[] = ['massMin', 'massMax', 'periodMinDays', 'periodMaxDays', 'occurrence', 'massSlope', 'periodSlope', 'meanLog10PeriodDays', 'sigmaLog10Period'];

// 1e10 rather than 10000000000, so the cell shows the whole number.
const text = (v: number | undefined) => (v === undefined ? '' : formatNumber(v));

/** A stored row as text cells (the CSV's columns); readRowCells reads them back to the same row. */
export function cellsFromRow(row: CompanionRow): RowCells {
  const [unit, range] = row.massMJup ? ['MJup', row.massMJup] : row.massMsun ? ['Msun', row.massMsun] : ['q', row.massRatio ?? [undefined, undefined]];
  const shape = row.shape;
  return {
    class: row.class,
    massUnit: unit as string,
    massMin: text(range[0]),
    massMax: text(range[1]),
    periodMinDays: text(row.periodDays[0]),
    periodMaxDays: text(row.periodDays[1]),
    occurrence: text(row.occurrence),
    shape: shape.kind,
    massSlope: shape.kind === 'powerlaw' ? text(shape.massSlope) : '',
    periodSlope: shape.kind === 'powerlaw' ? text(shape.periodSlope) : '',
    meanLog10PeriodDays: shape.kind === 'lognormalPeriod' ? text(shape.meanLog10PeriodDays) : '',
    sigmaLog10Period: shape.kind === 'lognormalPeriod' ? text(shape.sigmaLog10Period) : '',
    label: row.label ?? '',
    source: row.source ?? '',
    assumed: row.assumed ?? '',
  };
}

/** A schema path inside a row → the cell it came from. */
export function columnOfPath(path: readonly PropertyKey[]): CellColumn {
  const [first, second] = path;
  if (first === 'massMJup' || first === 'massMsun' || first === 'massRatio') return second === 1 ? 'massMax' : 'massMin';
  if (first === 'periodDays') return second === 1 ? 'periodMaxDays' : 'periodMinDays';
  if (first === 'shape') return second === 'kind' || second === undefined ? 'shape' : (second as CellColumn);
  if (first === undefined) return 'massUnit';
  return (OCCURRENCE_CSV_COLUMNS as readonly string[]).includes(String(first)) ? (first as CellColumn) : 'class';
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

/**
 * Reads one row of cells (trimmed) with the shared row schema. `parseNumber` reads a numeric cell
 * (null when empty, NaN when not a number); the client passes its friendlier number-input reader.
 * A missing shape means a power law.
 */
export function readRowCells(cells: Partial<RowCells>, parseNumber: (text: string) => number | null = plainNumber): RowCellsCheck {
  const cell = (column: CellColumn) => (cells[column] ?? '').trim();
  const problems: RowCellProblem[] = [];
  const numbers: Partial<Record<CellColumn, number>> = {};
  for (const column of NUMERIC) {
    const raw = cell(column);
    const value = parseNumber(raw);
    if (value === null) continue;
    if (Number.isNaN(value)) problems.push({ column, field: column, message: `${column} must be a number (got "${raw}")` });
    else numbers[column] = value;
  }
  const unit = cell('massUnit');
  const massKey = MASS_UNIT_KEYS[unit as MassUnit];
  if (!massKey) problems.push({ column: 'massUnit', field: 'massUnit', message: `massUnit must be one of MJup, Msun, q (got "${unit}")` });
  if (problems.length > 0) return { ok: false, problems };

  const shapeKind = cell('shape') || 'powerlaw';
  const shape =
    shapeKind === 'lognormalPeriod'
      ? { kind: shapeKind, meanLog10PeriodDays: numbers.meanLog10PeriodDays, sigmaLog10Period: numbers.sigmaLog10Period }
      : { kind: shapeKind, massSlope: numbers.massSlope, periodSlope: numbers.periodSlope };
  const candidate: Record<string, unknown> = {
    class: cell('class'),
    [massKey]: [numbers.massMin, numbers.massMax],
    periodDays: [numbers.periodMinDays, numbers.periodMaxDays],
    occurrence: numbers.occurrence,
    shape: Object.fromEntries(Object.entries(shape).filter(([, v]) => v !== undefined)),
  };
  for (const column of ['label', 'source', 'assumed'] as const) if (cell(column) !== '') candidate[column] = cell(column);
  const parsed = parseFields(companionRowSchema, candidate);
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
