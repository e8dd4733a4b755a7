import Papa from 'papaparse';
import { OCCURRENCE_CSV_COLUMNS, type CsvProblem } from '../../../../shared/contracts/occurrence-tables-api.ts';

/** One line of an uploaded file as written, with the problems the server found on it. */
export interface PreviewLine {
  /** The file line as the server counts it: the header is line 1, the first row line 2. */
  line: number;
  cells: Record<string, string>;
  problems: CsvProblem[];
}

export interface CsvPreview {
  header: string[];
  lines: PreviewLine[];
  /** Problems of the file as a whole (the header, or a line past the end). */
  fileProblems: CsvProblem[];
}

/**
 * The raw lines of a CSV next to the server's problem report, so that a bad cell can be shown
 * where it is. Read with the server's own settings (papaparse, header row, empty lines
 * skipped), so the line numbers agree with the report.
 */
export function previewLines(text: string, problems: readonly CsvProblem[]): CsvPreview {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: (h) => h.trim() });
  const header = (parsed.meta.fields ?? []).filter((f) => f !== '');
  const byLine = new Map<number, CsvProblem[]>();
  for (const p of problems) byLine.set(p.line, [...(byLine.get(p.line) ?? []), p]);
  const lines = parsed.data.map((cells, index) => ({ line: index + 2, cells, problems: byLine.get(index + 2) ?? [] }));
  const known = new Set(lines.map((l) => l.line));
  return { header, lines, fileProblems: problems.filter((p) => !known.has(p.line)) };
}

/** What to draw: every line with a problem, and the first lines up to `limit` in all. */
export function linesToShow(lines: readonly PreviewLine[], limit: number): PreviewLine[] {
  const withProblems = lines.filter((l) => l.problems.length > 0);
  const room = Math.max(0, limit - withProblems.length);
  const shown = new Set([...withProblems, ...lines.filter((l) => l.problems.length === 0).slice(0, room)]);
  return lines.filter((l) => shown.has(l));
}

/** A file to start from: the header and one row of each shape, with their sources. */
export function csvTemplate(): string {
  const rows = [
    ['planet', 'MJup', '0.3', '10', '2', '2000', '0.105', 'powerlaw', '-0.31', '0.26', '', '', 'Giant planets', 'Cumming et al. 2008, PASP 120, 531', ''],
    ['star', 'Msun', '0.08', '0.6', '1', '1e10', '0.23', 'lognormalPeriod', '', '', '5.03', '2.28', 'M-dwarf companions', 'Raghavan et al. 2010, ApJS 190, 1', 'flat in mass'],
  ];
  return Papa.unparse({ fields: [...OCCURRENCE_CSV_COLUMNS], data: rows }, { newline: '\n' }) + '\n';
}
