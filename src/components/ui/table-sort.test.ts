import { describe, expect, it } from 'vitest';
import { nextSort, sortRows } from './table-sort.ts';

describe('table sorting', () => {
  it('sorts text naturally and without regard to case', () => {
    const rows = ['run 10', 'Run 9', 'run 1'];
    expect(sortRows(rows, (r) => r, 'ascending')).toEqual(['run 1', 'Run 9', 'run 10']);
    expect(sortRows(rows, (r) => r, 'descending')).toEqual(['run 10', 'Run 9', 'run 1']);
  });

  it('sorts numbers and dates by value and keeps empty values last both ways', () => {
    const rows = [{ v: 2 }, { v: null }, { v: -1 }, { v: Number.NaN }, { v: 10 }];
    expect(sortRows(rows, (r) => r.v, 'ascending').map((r) => r.v)).toEqual([-1, 2, 10, null, Number.NaN]);
    expect(sortRows(rows, (r) => r.v, 'descending').map((r) => r.v)).toEqual([10, 2, -1, null, Number.NaN]);
    const dates = ['2026-03-01', '2025-12-31'].map((d) => new Date(d));
    expect(sortRows(dates, (d) => d, 'ascending')).toEqual([dates[1], dates[0]]);
  });

  it('keeps the input order of ties and does not touch the input', () => {
    const rows = [{ k: 'b', n: 1 }, { k: 'a', n: 2 }, { k: 'b', n: 3 }];
    const copy = structuredClone(rows);
    expect(sortRows(rows, (r) => r.k, 'ascending').map((r) => r.n)).toEqual([2, 1, 3]);
    expect(rows).toEqual(copy);
  });

  it('starts a new column ascending and flips the same column', () => {
    expect(nextSort(null, 'name')).toEqual({ columnId: 'name', direction: 'ascending' });
    expect(nextSort({ columnId: 'name', direction: 'ascending' }, 'name')).toEqual({ columnId: 'name', direction: 'descending' });
    expect(nextSort({ columnId: 'name', direction: 'descending' }, 'name')).toEqual({ columnId: 'name', direction: 'ascending' });
    expect(nextSort({ columnId: 'name', direction: 'descending' }, 'joined')).toEqual({ columnId: 'joined', direction: 'ascending' });
  });
});
