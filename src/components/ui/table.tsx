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
  /** The label before the value when rows are stacked; `false` for none (an actions column). */
  stackedLabel?: ReactNode | false;
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
  /** Below 768 px, show each row as a block of labelled values instead of scrolling sideways. */
  stackOnNarrow?: boolean;
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

/** A data table with sortable columns; on narrow screens it scrolls sideways or stacks its rows. */
export function Table<T>({ caption, hideCaption, columns, rows, rowKey, initialSort, empty, stackOnNarrow = false }: TableProps<T>) {
  const [sort, setSort] = useState<SortState | null>(initialSort ?? null);
  const captionId = useId();

  const sorted = useMemo(() => {
    if (!sort) return rows;
    const value = columns.find((c) => c.id === sort.columnId)?.sortValue;
    return value ? sortRows(rows, value, sort.direction) : rows;
  }, [rows, columns, sort]);

  // Stacked below 768 px: each row becomes a block of "label value" lines and the sortable
  // headers a row of sort buttons. Explicit roles keep the table semantics that display:block
  // would otherwise drop in some browsers.
  const stack = stackOnNarrow;
  const role = (name: string) => (stack ? name : undefined);

  return (
    <div role="region" aria-labelledby={captionId} tabIndex={0} className="relative overflow-x-auto rounded-md border border-ink-700">
      <table role={role('table')} className={cx('w-full border-collapse text-left', stack && 'max-md:block')}>
        <caption id={captionId} className={hideCaption ? 'sr-only' : 'px-4 py-3 text-left font-bold text-foam-50'}>
          {caption}
        </caption>
        <thead role={role('rowgroup')} className={cx('bg-ink-800 text-foam-300', stack && 'max-md:block')}>
          <tr role={role('row')} className={cx(stack && 'max-md:flex max-md:flex-wrap max-md:items-center max-md:gap-1 max-md:p-2')}>
            {columns.map((column) =>
              column.sortValue ? (
                <SortableHeaderCell
                  key={column.id}
                  role={role('columnheader')}
                  align={column.align}
                  direction={sort?.columnId === column.id ? sort.direction : 'none'}
                  onSort={() => setSort((current) => nextSort(current, column.id))}
                  className={cx(stack && 'max-md:p-0')}
                >
                  {column.header}
                </SortableHeaderCell>
              ) : (
                <th
                  key={column.id}
                  role={role('columnheader')}
                  scope="col"
                  className={cx(cellClasses, 'font-bold', alignClass(column.align), stack && 'max-md:sr-only')}
                >
                  {column.header}
                </th>
              ),
            )}
          </tr>
        </thead>
        <tbody role={role('rowgroup')} className={cx(stack && 'max-md:block')}>
          {sorted.length === 0 && empty ? (
            <tr role={role('row')} className={cx(stack && 'max-md:block')}>
              <td role={role('cell')} colSpan={columns.length} className={cx('p-4', stack && 'max-md:block')}>
                {empty}
              </td>
            </tr>
          ) : (
            sorted.map((row) => (
              <tr
                key={rowKey(row)}
                role={role('row')}
                className={cx('border-t border-ink-700 hover:bg-ink-800/60', stack && 'max-md:block max-md:px-4 max-md:py-3')}
              >
                {columns.map((column) => {
                  const Cell = column.rowHeader ? 'th' : 'td';
                  const label = column.stackedLabel ?? column.header;
                  return (
                    <Cell
                      key={column.id}
                      role={role(column.rowHeader ? 'rowheader' : 'cell')}
                      scope={column.rowHeader ? 'row' : undefined}
                      className={cx(
                        cellClasses,
                        alignClass(column.align),
                        column.rowHeader && 'font-bold',
                        stack && 'max-md:flex max-md:items-center max-md:gap-4 max-md:px-0 max-md:py-1.5 max-md:[overflow-wrap:anywhere]',
                        stack && (label === false ? 'max-md:justify-end' : 'max-md:justify-between'),
                        column.className,
                      )}
                    >
                      {stack && !column.rowHeader && label !== false && (
                        <span aria-hidden="true" className="shrink-0 font-normal whitespace-nowrap text-foam-400 md:hidden">
                          {label}
                        </span>
                      )}
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
