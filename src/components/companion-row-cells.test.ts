import { describe, expect, it } from 'vitest';
import type { CompanionRow } from '../../shared/contracts/occurrence-table.ts';
import { cellsFromRow, columnOfPath } from '../../shared/contracts/occurrence-row-cells.ts';
import { blankCells, cellOfServerField, checkCells, serverCellMessage } from './companion-row-cells.ts';

// The first row of the baseline table (shared/scenarios/baseline-occurrence.json).
const cumming: CompanionRow = {
  label: 'Giant planets, 2–2000 d',
  class: 'planet',
  massMJup: [0.3, 10],
  periodDays: [2, 2000],
  occurrence: 0.105,
  shape: { kind: 'powerlaw', massSlope: -0.31, periodSlope: 0.26 },
  source: 'Cumming et al. 2008',
};

describe('row cells', () => {
  it('round-trips a stored row through the cells', () => {
    const cells = cellsFromRow(cumming);
    expect(cells).toMatchObject({ massUnit: 'MJup', massMin: '0.3', occurrence: '0.105', massSlope: '-0.31', meanLog10PeriodDays: '' });
    expect(checkCells(cells)).toEqual({ ok: true, row: cumming });
  });

  it('reads a log-normal row in solar masses', () => {
    const row: CompanionRow = { class: 'star', massMsun: [0.08, 0.6], periodDays: [1, 1e10], occurrence: 0.23, shape: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 } };
    expect(checkCells(cellsFromRow(row))).toEqual({ ok: true, row });
  });

  it('names the cell of each problem with the allowed range', () => {
    expect(checkCells({ ...blankCells(), occurrence: '1.5' })).toEqual({ ok: false, problems: [{ column: 'occurrence', message: 'Must be between 0 and 1 (got 1.5)' }] });
    expect(checkCells({ ...blankCells(), occurrence: '0.1', massMin: '20' })).toEqual({
      ok: false,
      problems: [{ column: 'massMin', message: 'Must be a range [low, high] with low below high (got [20, 10])' }],
    });
    expect(checkCells({ ...blankCells(), occurrence: '0.1', massMax: '5000' })).toEqual({
      ok: false,
      problems: [{ column: 'massMax', message: 'Must be between 0.001 and 1000 (got 5000)' }],
    });
  });

  it('says when a typed value is not a number, or missing', () => {
    expect(checkCells({ ...blankCells(), occurrence: 'ten' })).toEqual({ ok: false, problems: [{ column: 'occurrence', message: 'Must be a number (got "ten")' }] });
    const missing = checkCells(blankCells());
    expect(missing).toEqual({ ok: false, problems: [{ column: 'occurrence', message: 'Is required' }] });
  });

  it('maps schema paths and server fields to cells', () => {
    expect(columnOfPath(['massRatio', 1])).toBe('massMax');
    expect(columnOfPath(['periodDays', 0])).toBe('periodMinDays');
    expect(columnOfPath(['shape', 'sigmaLog10Period'])).toBe('sigmaLog10Period');
    expect(cellOfServerField('rows.3.occurrence')).toEqual({ index: 3, column: 'occurrence' });
    expect(cellOfServerField('rows.0.massMJup.1')).toEqual({ index: 0, column: 'massMax' });
    expect(cellOfServerField('rows.2')).toEqual({ index: 2, column: null });
    expect(cellOfServerField('name')).toBeNull();
    expect(serverCellMessage('rows.0.occurrence', 'rows.0.occurrence: Too big: expected number to be <=1')).toBe('Too big: expected number to be <=1');
  });
});
