import Papa from 'papaparse';
import { CONSTRAINT_CSV_COLUMNS, type CoolingAgeBin } from '../../../shared/contracts/constraints.ts';
import type { CsvProblem } from '../../../shared/contracts/occurrence-tables-api.ts';

type ListKind = keyof typeof CONSTRAINT_CSV_COLUMNS;

export interface ParsedConstraintCsv {
  values: number[];
  bins: CoolingAgeBin[];
  problems: CsvProblem[];
}

/**
 * Reads the list of a constraint from CSV text (header row required, the columns of
 * CONSTRAINT_CSV_COLUMNS[kind] in any order, other columns ignored). Every problem is reported with
 * its file line (the header is line 1) and column; the caller stores nothing unless `problems` is
 * empty. Range checks are left to the constraint's schema, which names the value's index.
 */
export function parseConstraintCsv(kind: ListKind, text: string): ParsedConstraintCsv {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: (h) => h.trim() });
  const columns = CONSTRAINT_CSV_COLUMNS[kind] as readonly string[];
  const header = parsed.meta.fields ?? [];
  const problems: CsvProblem[] = columns
    .filter((c) => !header.includes(c))
    .map((c) => ({ line: 1, column: c, message: `the header has no column ${c} (required: ${columns.join(', ')})` }));
  if (problems.length > 0) return { values: [], bins: [], problems };
  for (const e of parsed.errors) {
    if (e.code === 'TooFewFields' || e.code === 'TooManyFields' || e.type === 'Quotes') problems.push({ line: (e.row ?? 0) + 2, message: e.message });
  }
  const values: number[] = [];
  const bins: CoolingAgeBin[] = [];
  parsed.data.forEach((record, index) => {
    const line = index + 2;
    const numbers: Record<string, number> = {};
    let ok = true;
    for (const c of columns) {
      const raw = (record[c] ?? '').trim();
      const value = raw === '' ? Number.NaN : Number(raw);
      const whole = c === 'magnetic' || c === 'total';
      if (!Number.isFinite(value) || (whole && !Number.isInteger(value))) {
        problems.push({ line, column: c, message: `${c} must be ${whole ? 'a whole number' : 'a number'} (got "${raw}")` });
        ok = false;
      } else numbers[c] = value;
    }
    if (!ok) return;
    if (kind === 'coolingAgeIncidence') {
      bins.push({ ageMinGyr: numbers.ageMinGyr, ageMaxGyr: numbers.ageMaxGyr, magnetic: numbers.magnetic, total: numbers.total });
    } else values.push(numbers[columns[0]]);
  });
  if (parsed.data.length === 0 && problems.length === 0) problems.push({ line: 2, message: 'the file has a header but no rows' });
  return { values, bins, problems };
}
