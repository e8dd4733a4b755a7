import type { Response } from 'express';
import Papa from 'papaparse';

/**
 * Cells a spreadsheet would read as a formula: starting with =, +, @, tab or CR, or with -
 * unless the whole cell is a number (OWASP "CSV Injection"; numbers stay numbers).
 */
const FORMULA_START = /^(?:[=+@\t\r]|-(?!(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$))/;

/**
 * Writes rows as CSV with papaparse (quoting as RFC 4180), with every formula-like text cell
 * neutralised by a leading apostrophe so that opening an export never runs what a user typed.
 */
export function toCsv(fields: readonly string[], rows: readonly (readonly unknown[])[]): string {
  return Papa.unparse({ fields: [...fields], data: rows.map((r) => [...r]) }, { newline: '\n', escapeFormulae: FORMULA_START }) + '\n';
}

/**
 * Sends a download: Content-Disposition (and Content-Type from the extension) through Express's
 * res.attachment; `contentType` names the type where the extension does not (e.g. `.ecsv`).
 */
export function sendDownload(res: Response, filename: string, body: string, contentType?: string): void {
  res.attachment(filename);
  if (contentType) res.type(`${contentType}; charset=utf-8`);
  res.send(body);
}
