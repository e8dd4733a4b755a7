import { OCCURRENCE_CSV_COLUMNS } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { companionRowSchema, type CompanionRow } from '../../../../shared/contracts/occurrence-table.ts';
import { describeIssues, formatNumber } from '../../../../shared/contracts/schema-issues.ts';
import { parseNumberText } from '../../../lib/number-input.ts';

/**
 * The row editor's cells are the CSV's columns (OCCURRENCE_CSV_COLUMNS), held as text while
 * they are typed, so that a problem from the live check, from a CSV preview or from the server
 * ("rows.3.occurrence") is named by the same column and lands in the same cell.
 */
export type CellColumn = (typeof OCCURRENCE_CSV_COLUMNS)[number];
export type RowCells = Record<CellColumn, string>;

export const MASS_UNIT_KEYS = { MJup: 'massMJup', Msun: 'massMsun', q: 'massRatio' } as const;
export type MassUnit = keyof typeof MASS_UNIT_KEYS;

const NUMERIC: readonly CellColumn[] = ['massMin', 'massMax', 'periodMinDays', 'periodMaxDays', 'occurrence', 'massSlope', 'periodSlope', 'meanLog10PeriodDays', 'sigmaLog10Period'];

// 1e10 rather than 10000000000, so the cell shows the whole number.
const text = (v: number | undefined) => (v === undefined ? '' : formatNumber(v));

/** A stored row as the editor's text cells (the columns a CSV download has). */
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

/** A new row to fill in: giant planets, log-uniform. */
export function blankCells(): RowCells {
  return {
    class: 'planet',
    massUnit: 'MJup',
    massMin: '1',
    massMax: '10',
    periodMinDays: '10',
    periodMaxDays: '1000',
    occurrence: '',
    shape: 'powerlaw',
    massSlope: '0',
    periodSlope: '0',
    meanLog10PeriodDays: '',
    sigmaLog10Period: '',
    label: '',
    source: '',
    assumed: '',
  };
}

/** The shape parameters that apply to a shape kind (the others are ignored). */
export function shapeColumns(shape: string): readonly CellColumn[] {
  return shape === 'lognormalPeriod' ? ['meanLog10PeriodDays', 'sigmaLog10Period'] : ['massSlope', 'periodSlope'];
}

/** A schema path inside a row → the cell it came from (the server's CSV reader maps the same way). */
export function columnOfPath(path: readonly (string | number)[]): CellColumn {
  const [first, second] = path;
  if (first === 'massMJup' || first === 'massMsun' || first === 'massRatio') return second === 1 ? 'massMax' : 'massMin';
  if (first === 'periodDays') return second === 1 ? 'periodMaxDays' : 'periodMinDays';
  if (first === 'shape') return second === 'kind' || second === undefined ? 'shape' : (second as CellColumn);
  if (first === undefined) return 'massUnit';
  return (OCCURRENCE_CSV_COLUMNS as readonly string[]).includes(String(first)) ? (first as CellColumn) : 'class';
}

/** "massMJup[1]" or "shape.massSlope" → its path parts. */
function pathOf(field: string): (string | number)[] {
  return field
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .filter(Boolean)
    .map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}

/** The message without the field name it starts with, as a sentence. */
function cellMessage(field: string, message: string): string {
  let body = message;
  if (field && body.startsWith(`${field}: `)) body = body.slice(field.length + 2);
  else if (field && body.startsWith(`${field} `)) body = body.slice(field.length + 1);
  return body.charAt(0).toUpperCase() + body.slice(1);
}

export interface CellProblem {
  column: CellColumn;
  message: string;
}

export type RowCheck = { ok: true; row: CompanionRow } | { ok: false; problems: CellProblem[] };

/** Reads and checks one row of cells with the shared row schema; every problem names its cell. */
export function checkCells(cells: RowCells): RowCheck {
  const problems: CellProblem[] = [];
  const numbers: Partial<Record<CellColumn, number>> = {};
  for (const column of NUMERIC) {
    const value = parseNumberText(cells[column]);
    if (value === null) continue;
    if (Number.isNaN(value)) problems.push({ column, message: `Must be a number (got "${cells[column].trim()}")` });
    else numbers[column] = value;
  }
  const massKey = MASS_UNIT_KEYS[cells.massUnit as MassUnit];
  if (!massKey) problems.push({ column: 'massUnit', message: `Must be one of MJup, Msun, q (got "${cells.massUnit}")` });
  if (problems.length > 0) return { ok: false, problems };

  const shape =
    cells.shape === 'lognormalPeriod'
      ? { kind: cells.shape, meanLog10PeriodDays: numbers.meanLog10PeriodDays, sigmaLog10Period: numbers.sigmaLog10Period }
      : { kind: cells.shape || 'powerlaw', massSlope: numbers.massSlope, periodSlope: numbers.periodSlope };
  const candidate: Record<string, unknown> = {
    class: cells.class,
    [massKey]: [numbers.massMin, numbers.massMax],
    periodDays: [numbers.periodMinDays, numbers.periodMaxDays],
    occurrence: numbers.occurrence,
    shape: Object.fromEntries(Object.entries(shape).filter(([, v]) => v !== undefined)),
  };
  for (const column of ['label', 'source', 'assumed'] as const) if (cells[column].trim() !== '') candidate[column] = cells[column].trim();
  const parsed = companionRowSchema.safeParse(candidate, { reportInput: true });
  if (parsed.success) return { ok: true, row: parsed.data };
  return {
    ok: false,
    problems: describeIssues(companionRowSchema, candidate, parsed.error.issues).map((issue) => ({
      column: columnOfPath(pathOf(issue.field === 'scenario' ? '' : issue.field)),
      message: cellMessage(issue.field, issue.message),
    })),
  };
}

/** Where the server's error of a rows save belongs: "rows.3.occurrence" → row 3, column occurrence. */
export function cellOfServerField(field: string | undefined): { index: number; column: CellColumn | null } | null {
  const match = field ? /^rows\.(\d+)(?:\.(.+))?$/.exec(field) : null;
  if (!match) return null;
  return { index: Number(match[1]), column: match[2] ? columnOfPath(pathOf(match[2])) : null };
}

/** The server's message shown in a cell: without the "rows.3.occurrence: " it starts with. */
export function serverCellMessage(field: string, message: string): string {
  return cellMessage(field, message);
}

export const cellKey = (index: number, column: CellColumn) => `${index}:${column}`;
