import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ROW_CELL_COLUMNS, cellsFromRow, columnOfPath, pathOfColumn, readRowCells, rowCandidate } from './occurrence-row-cells.ts';
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

  it('carries the host-mass slope, which a CSV has no column for, so that saving a table keeps it', () => {
    const row: CompanionRow = { ...baseline.rows[0], hostMassSlope: 1 };
    expect(cellsFromRow(row).hostMassSlope).toBe('1');
    expect(readRowCells(cellsFromRow(row))).toEqual({ ok: true, row });
    // Johnson et al. 2010's trend is roughly linear in M1; the schema allows slopes from -3 to 3.
    const steep = readRowCells({ ...cellsFromRow(row), hostMassSlope: '4' });
    expect(steep.ok ? [] : steep.problems.map((p) => [p.column, p.message])).toEqual([['hostMassSlope', 'hostMassSlope must be between -3 and 3 (got 4)']]);
  });

  it('names each cell by the path of its value, the inverse of columnOfPath', () => {
    for (const unit of ['MJup', 'Msun', 'q']) {
      for (const column of ROW_CELL_COLUMNS) if (column !== 'massUnit') expect(columnOfPath(pathOfColumn(column, unit))).toBe(column);
    }
    expect(pathOfColumn('massMax', 'Msun')).toEqual(['massMsun', 1]);
    expect(pathOfColumn('sigmaLog10Period', 'MJup')).toEqual(['shape', 'sigmaLog10Period']);
  });

  it('reads a draft row that is not valid yet into cells and back, keeping what the schema must name', () => {
    const cells = cellsFromRow({ class: 'planet', massMsun: [0.1, Number.NaN], occurrence: 0.2 });
    expect(cells).toMatchObject({ massUnit: 'Msun', massMin: '0.1', massMax: '', periodMinDays: '', shape: '' });
    expect(rowCandidate({ ...cells, periodMinDays: 'ten' })).toEqual({
      class: 'planet',
      massMsun: [0.1, undefined],
      periodDays: [Number.NaN, undefined],
      occurrence: 0.2,
      shape: { kind: 'powerlaw' },
    });
  });
});
