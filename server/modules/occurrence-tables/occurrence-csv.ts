import { nearestColumn } from './column-suggestion.ts';
import Papa from 'papaparse';
import {
  OCCURRENCE_CSV_COLUMNS,
  OCCURRENCE_CSV_REQUIRED,
  STORED_TABLE_MAX_ROWS,
  type CsvProblem,
} from '../../../shared/contracts/occurrence-tables-api.ts';
import { readRowCells } from '../../../shared/contracts/occurrence-row-cells.ts';
import type { CompanionRow } from '../../../shared/contracts/occurrence-table.ts';
import { toCsv } from '../../lib/csv.ts';

export interface ParsedCsv {
  rows: CompanionRow[];
  problems: CsvProblem[];
  rowCount: number;
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
  if (parsed.data.length === 0) {
    return { rows: [], problems: [{ line: 2, message: 'the file has no rows below its header; add at least one companion row' }], rowCount: 0 };
  }
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
    const check = readRowCells(record);
    if (check.ok) {
      rows.push(check.row);
      return;
    }
    for (const { column, field, message } of check.problems) {
      problems.push({ line, column, message: field && message.startsWith(field) ? column + message.slice(field.length) : `${column}: ${message}` });
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
  return toCsv(OCCURRENCE_CSV_COLUMNS, records.map((r) => OCCURRENCE_CSV_COLUMNS.map((c) => r[c])));
}
