import { useId, useMemo, useState, type ReactNode, type ThHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names.ts';
import { SortIcon } from './icons.tsx';
import { nextSort, sortRows, type SortDirection, type SortState, type SortValue } from './table-sort.ts';

export interface TableColumn<T> {
  id: string;
  header: ReactNode;
  cell: (row: T) => ReactNode;
  /** Makes the column sortable by this value. */
  sortValue?: (row: T) => SortValue;
  /** `end` for numbers, so that digits line up. */
  align?: 'start' | 'end';
  /** This column names the row (rendered as a row header). */
  rowHeader?: boolean;
  className?: string;
}

export interface TableProps<T> {
  /** Says what the table holds; required for screen readers, can be visually hidden. */
  caption: ReactNode;
  hideCaption?: boolean;
  columns: readonly TableColumn<T>[];
  rows: readonly T[];
  rowKey: (row: T) => string;
  initialSort?: SortState;
  /** Shown in place of the body when there are no rows. */
  empty?: ReactNode;
}

const alignClass = (align: 'start' | 'end' = 'start') => (align === 'end' ? 'text-right' : 'text-left');
const cellClasses = 'px-4 py-3 align-middle';

export interface SortableHeaderCellProps extends Omit<ThHTMLAttributes<HTMLTableCellElement>, 'children' | 'align'> {
  children: ReactNode;
  direction: SortDirection | 'none';
  onSort: () => void;
  align?: 'start' | 'end';
}

/** A column header that sorts on click; announces its state with aria-sort. */
export function SortableHeaderCell({ children, direction, onSort, align, className, ...th }: SortableHeaderCellProps) {
  return (
    <th
      scope="col"
      aria-sort={direction}
      className={cx('px-2 py-1.5 font-bold', alignClass(align), className)}
      {...th}
    >
      <button
        type="button"
        onClick={onSort}
        className={cx(
          'inline-flex min-h-9 items-center gap-1 rounded px-2 font-bold hover:bg-ink-700',
          align === 'end' && 'flex-row-reverse',
        )}
      >
        {children}
        <SortIcon direction={direction} className="size-4" />
      </button>
    </th>
  );
}

/** A data table with sortable columns, scrolling sideways on narrow screens. */
export function Table<T>({ caption, hideCaption, columns, rows, rowKey, initialSort, empty }: TableProps<T>) {
  const [sort, setSort] = useState<SortState | null>(initialSort ?? null);
  const captionId = useId();

  const sorted = useMemo(() => {
    if (!sort) return rows;
    const value = columns.find((c) => c.id === sort.columnId)?.sortValue;
    return value ? sortRows(rows, value, sort.direction) : rows;
  }, [rows, columns, sort]);

  return (
    <div role="region" aria-labelledby={captionId} tabIndex={0} className="relative overflow-x-auto rounded-md border border-ink-700">
      <table className="w-full border-collapse text-left">
        <caption id={captionId} className={hideCaption ? 'sr-only' : 'px-4 py-3 text-left font-bold text-foam-50'}>
          {caption}
        </caption>
        <thead className="bg-ink-800 text-foam-300">
          <tr>
            {columns.map((column) =>
              column.sortValue ? (
                <SortableHeaderCell
                  key={column.id}
                  align={column.align}
                  direction={sort?.columnId === column.id ? sort.direction : 'none'}
                  onSort={() => setSort((current) => nextSort(current, column.id))}
                >
                  {column.header}
                </SortableHeaderCell>
              ) : (
                <th key={column.id} scope="col" className={cx(cellClasses, 'font-bold', alignClass(column.align))}>
                  {column.header}
                </th>
              ),
            )}
          </tr>
        </thead>
        <tbody>
          {sorted.length === 0 && empty ? (
            <tr>
              <td colSpan={columns.length} className="p-4">
                {empty}
              </td>
            </tr>
          ) : (
            sorted.map((row) => (
              <tr key={rowKey(row)} className="border-t border-ink-700 hover:bg-ink-800/60">
                {columns.map((column) => {
                  const Cell = column.rowHeader ? 'th' : 'td';
                  return (
                    <Cell
                      key={column.id}
                      scope={column.rowHeader ? 'row' : undefined}
                      className={cx(cellClasses, alignClass(column.align), column.rowHeader && 'font-bold', column.className)}
                    >
                      {column.cell(row)}
                    </Cell>
                  );
                })}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
