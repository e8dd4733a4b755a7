import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cellsFromRow, readRowCells } from './occurrence-row-cells.ts';
import type { CompanionRow } from './occurrence-table.ts';

// The stored baseline table (shared/scenarios/baseline-occurrence.json) as written by hand from
// its papers; writing its rows as CSV-style text cells and reading them back gives the same rows.
const baseline = JSON.parse(readFileSync(new URL('../scenarios/baseline-occurrence.json', import.meta.url), 'utf8')) as { rows: CompanionRow[] };

describe('readRowCells (the one row reader of the CSV upload and the row editor)', () => {
  it('reads every row of the baseline table back from text cells', () => {
    expect(baseline.rows.length).toBeGreaterThan(0);
    for (const row of baseline.rows) expect(readRowCells(cellsFromRow(row))).toEqual({ ok: true, row });
  });

  it('names the column of each problem, with the message starting with the field it names', () => {
    const row = cellsFromRow(baseline.rows[0]);
    expect(readRowCells({ ...row, massMax: 'ten' })).toEqual({ ok: false, problems: [{ column: 'massMax', field: 'massMax', message: 'massMax must be a number (got "ten")' }] });
    expect(readRowCells({ ...row, massUnit: 'kg' })).toEqual({ ok: false, problems: [{ column: 'massUnit', field: 'massUnit', message: 'massUnit must be one of MJup, Msun, q (got "kg")' }] });
    const big = readRowCells({ ...row, occurrence: '1.3' });
    expect(big).toEqual({ ok: false, problems: [{ column: 'occurrence', field: 'occurrence', message: 'occurrence must be between 0 and 1 (got 1.3)' }] });
    const upper = readRowCells({ ...row, massMax: '5000' });
    expect(upper.ok ? [] : upper.problems.map((p) => [p.column, p.field])).toEqual([['massMax', 'massMJup[1]']]);
  });

  it('takes the caller’s number reader (the client accepts "10^3")', () => {
    const row = { ...cellsFromRow(baseline.rows[0]), periodMaxDays: '10^3' };
    expect(readRowCells(row).ok).toBe(false);
    const friendly = (text: string) => (text === '' ? null : text === '10^3' ? 1000 : Number(text));
    expect(readRowCells(row, friendly)).toMatchObject({ ok: true, row: { periodDays: [2, 1000] } });
  });
});
