import {
  columnOfPath,
  pathOfField,
  readRowCells,
  type CellColumn,
  type RowCells,
} from '../../shared/contracts/occurrence-row-cells.ts';
import type { CompanionRow } from '../../shared/contracts/occurrence-table.ts';
import { parseNumberText } from '../lib/number-input.ts';

/**
 * The companion-row editor's cells (shared/contracts/occurrence-row-cells.ts: the CSV's columns
 * and the host-mass slope), held as text while they are typed, and read by the same reader as the
 * server's CSV upload, so that a problem from the live check, from a CSV preview or from the
 * server ("rows.3.occurrence") is named by the same column and lands in the same cell. Here, the
 * client's side of it: the words shown in a cell and where a server's answer belongs.
 */

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
    hostMassSlope: '',
    label: '',
    source: '',
    assumed: '',
  };
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

/** Reads and checks one row of cells with the shared row reader; every problem names its cell. */
export function checkCells(cells: RowCells): RowCheck {
  const check = readRowCells(cells, (text) => parseNumberText(text));
  if (check.ok) return check;
  return {
    ok: false,
    problems: check.problems.map(({ column, field, message }) => ({ column, message: cellMessage(field, message) })),
  };
}

/** Where the server's error of a rows save belongs: "rows.3.occurrence" → row 3, column occurrence. */
export function cellOfServerField(field: string | undefined): { index: number; column: CellColumn | null } | null {
  const match = field ? /^rows\.(\d+)(?:\.(.+))?$/.exec(field) : null;
  if (!match) return null;
  return { index: Number(match[1]), column: match[2] ? columnOfPath(pathOfField(match[2])) : null };
}

/** The server's message shown in a cell: without the "rows.3.occurrence: " it starts with. */
export function serverCellMessage(field: string, message: string): string {
  return cellMessage(field, message);
}

export const cellKey = (index: number, column: CellColumn) => `${index}:${column}`;
