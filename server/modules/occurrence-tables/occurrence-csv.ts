import { nearestColumn } from './column-suggestion.ts';
import Papa from 'papaparse';
import {
  OCCURRENCE_CSV_COLUMNS,
  OCCURRENCE_CSV_REQUIRED,
  STORED_TABLE_MAX_ROWS,
  type CsvProblem,
} from '../../../shared/contracts/occurrence-tables-api.ts';
import { companionRowSchema, type CompanionRow } from '../../../shared/contracts/occurrence-table.ts';
import { describeIssues } from '../../../shared/contracts/schema-issues.ts';

type Column = (typeof OCCURRENCE_CSV_COLUMNS)[number];

const MASS_KEYS = { MJup: 'massMJup', Msun: 'massMsun', q: 'massRatio' } as const;
const NUMERIC: Column[] = ['massMin', 'massMax', 'periodMinDays', 'periodMaxDays', 'occurrence', 'massSlope', 'periodSlope', 'meanLog10PeriodDays', 'sigmaLog10Period'];

export interface ParsedCsv {
  rows: CompanionRow[];
  problems: CsvProblem[];
  rowCount: number;
}

/** "massMJup[0]" → ['massMJup', 0]. */
function fieldPath(field: string): PropertyKey[] {
  if (!field) return [];
  return field
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .filter(Boolean)
    .map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}

/** Which CSV column a schema path of a companion row came from. */
function columnOf(path: readonly PropertyKey[]): Column {
  const [first, second] = path;
  if (first === 'massMJup' || first === 'massMsun' || first === 'massRatio') return second === 1 ? 'massMax' : 'massMin';
  if (first === 'periodDays') return second === 1 ? 'periodMaxDays' : 'periodMinDays';
  if (first === 'shape') return second === 'kind' || second === undefined ? 'shape' : (second as Column);
  if (first === undefined) return 'massUnit';
  return first as Column;
}

/**
 * Reads an occurrence table from CSV text (header row required; columns in any order). Every
 * problem is reported with its file line (the header is line 1) and column; rows with problems
 * are left out of `rows`, so a caller stores nothing unless `problems` is empty.
 */
export function parseOccurrenceCsv(text: string): ParsedCsv {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim(),
  });
  const problems: CsvProblem[] = [];
  const header = (parsed.meta.fields ?? []).filter((f) => f !== '');
  const missing = OCCURRENCE_CSV_REQUIRED.filter((c) => !header.includes(c));
  const unknown = header.filter((h) => !(OCCURRENCE_CSV_COLUMNS as readonly string[]).includes(h));
  for (const c of missing) problems.push({ line: 1, column: c, message: `the header has no column ${c} (required: ${OCCURRENCE_CSV_REQUIRED.join(', ')})` });
  for (const c of unknown) {
    const suggestion = nearestColumn(c, OCCURRENCE_CSV_COLUMNS);
    const hint = suggestion ? `did you mean ${suggestion}? ` : '';
    problems.push({ line: 1, column: c, message: `the header has an unknown column ${c} (${hint}allowed: ${OCCURRENCE_CSV_COLUMNS.join(', ')})` });
  }
  if (problems.length > 0) return { rows: [], problems, rowCount: parsed.data.length };
  if (parsed.data.length > STORED_TABLE_MAX_ROWS) {
    return {
      rows: [],
      problems: [{ line: STORED_TABLE_MAX_ROWS + 2, message: `the file has ${parsed.data.length} rows; a table holds at most ${STORED_TABLE_MAX_ROWS}` }],
      rowCount: parsed.data.length,
    };
  }
  for (const e of parsed.errors) {
    if (e.code === 'TooFewFields' || e.code === 'TooManyFields' || e.type === 'Quotes') {
      problems.push({ line: (e.row ?? 0) + 2, message: e.message });
    }
  }

  const rows: CompanionRow[] = [];
  parsed.data.forEach((record, index) => {
    const line = index + 2;
    const rowProblems: CsvProblem[] = [];
    const cell = (c: Column) => (record[c] ?? '').trim();
    const numbers: Partial<Record<Column, number>> = {};
    for (const c of NUMERIC) {
      const raw = cell(c);
      if (raw === '') continue;
      const value = Number(raw);
      if (!Number.isFinite(value)) rowProblems.push({ line, column: c, message: `${c} must be a number (got "${raw}")` });
      else numbers[c] = value;
    }
    const unit = cell('massUnit');
    const massKey = MASS_KEYS[unit as keyof typeof MASS_KEYS];
    if (!massKey) rowProblems.push({ line, column: 'massUnit', message: `massUnit must be one of MJup, Msun, q (got "${unit}")` });
    if (rowProblems.length > 0) {
      problems.push(...rowProblems);
      return;
    }
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
    for (const c of ['label', 'source', 'assumed'] as const) if (cell(c) !== '') candidate[c] = cell(c);
    const result = companionRowSchema.safeParse(candidate, { reportInput: true });
    if (result.success) {
      rows.push(result.data);
      return;
    }
    for (const issue of describeIssues(companionRowSchema, candidate, result.error.issues)) {
      const column = columnOf(fieldPath(issue.field));
      const message = issue.field && issue.message.startsWith(issue.field) ? column + issue.message.slice(issue.field.length) : `${column}: ${issue.message}`;
      problems.push({ line, column, message });
    }
  });
  return { rows, problems, rowCount: parsed.data.length };
}

/** Writes rows as CSV with the columns of OCCURRENCE_CSV_COLUMNS (the format parseOccurrenceCsv reads). */
export function formatOccurrenceCsv(rows: readonly CompanionRow[]): string {
  const records = rows.map((row) => {
    const [unit, range] = row.massMJup ? ['MJup', row.massMJup] : row.massMsun ? ['Msun', row.massMsun] : ['q', row.massRatio!];
    const shape = row.shape;
    return {
      class: row.class,
      massUnit: unit,
      massMin: range[0],
      massMax: range[1],
      periodMinDays: row.periodDays[0],
      periodMaxDays: row.periodDays[1],
      occurrence: row.occurrence,
      shape: shape.kind,
      massSlope: shape.kind === 'powerlaw' ? shape.massSlope : '',
      periodSlope: shape.kind === 'powerlaw' ? shape.periodSlope : '',
      meanLog10PeriodDays: shape.kind === 'lognormalPeriod' ? shape.meanLog10PeriodDays : '',
      sigmaLog10Period: shape.kind === 'lognormalPeriod' ? shape.sigmaLog10Period : '',
      label: row.label ?? '',
      source: row.source ?? '',
      assumed: row.assumed ?? '',
    };
  });
  return Papa.unparse({ fields: [...OCCURRENCE_CSV_COLUMNS], data: records.map((r) => OCCURRENCE_CSV_COLUMNS.map((c) => r[c])) }, { newline: '\n' }) + '\n';
}
