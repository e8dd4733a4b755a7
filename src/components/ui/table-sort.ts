export type SortDirection = 'ascending' | 'descending';
export interface SortState {
  columnId: string;
  direction: SortDirection;
}
export type SortValue = string | number | Date | null | undefined;

// Numeric collation so that "run 10" sorts after "run 9"; base sensitivity ignores case.
const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

function compareValues(a: SortValue, b: SortValue): number {
  if (a instanceof Date) a = a.getTime();
  if (b instanceof Date) b = b.getTime();
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return collator.compare(String(a), String(b));
}

/**
 * A sorted copy of `rows`. Empty values (null, undefined, NaN) go last in both directions;
 * ties keep their input order (Array.prototype.sort is stable).
 */
export function sortRows<T>(rows: readonly T[], value: (row: T) => SortValue, direction: SortDirection): T[] {
  const sign = direction === 'ascending' ? 1 : -1;
  const isEmpty = (v: SortValue) => v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v));
  return rows
    .map((row) => ({ row, key: value(row) }))
    .sort((x, y) => {
      const [ex, ey] = [isEmpty(x.key), isEmpty(y.key)];
      if (ex || ey) return Number(ex) - Number(ey);
      return sign * compareValues(x.key, y.key);
    })
    .map(({ row }) => row);
}

/** Clicking a header: a new column sorts ascending, the same column flips. */
export function nextSort(current: SortState | null, columnId: string): SortState {
  if (current?.columnId === columnId) {
    return { columnId, direction: current.direction === 'ascending' ? 'descending' : 'ascending' };
  }
  return { columnId, direction: 'ascending' };
}
