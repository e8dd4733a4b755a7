import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { TableSummary } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDate } from '../../../lib/format.ts';
import { tableCsvHref } from '../api/get-table-csv.ts';
import { useTables } from '../api/get-tables.ts';

const columns: TableColumn<TableSummary>[] = [
  {
    id: 'name',
    header: 'Name',
    rowHeader: true,
    sortValue: (t) => t.name.toLowerCase(),
    cell: (t) => <Link to={paths.occurrenceTables.detail.getHref(t.id)}>{t.name}</Link>,
  },
  { id: 'rows', header: 'Rows', align: 'end', sortValue: (t) => t.rowCount, cell: (t) => <span className="tabular-nums">{t.rowCount.toLocaleString('en-US')}</span> },
  {
    id: 'description',
    header: 'Description',
    cell: (t) => <span className="line-clamp-2 max-w-prose text-foam-300">{t.description ?? '—'}</span>,
  },
  { id: 'updated', header: 'Changed', sortValue: (t) => new Date(t.updatedAt), cell: (t) => <span className="whitespace-nowrap">{formatDate(t.updatedAt)}</span> },
  {
    id: 'csv',
    header: 'Download',
    stackedLabel: false,
    cell: (t) => (
      <a href={tableCsvHref(t.id)} download className="whitespace-nowrap">
        CSV<span className="sr-only"> of {t.name}</span>
      </a>
    ),
  },
];

/** The department's occurrence tables; scenarios name them by id. */
export function TablesList({ departmentId, emptyAction }: { departmentId: string; emptyAction?: ReactNode }) {
  const tables = useTables(departmentId);
  return (
    <QueryState query={tables} loadingLabel="Loading occurrence tables…" errorTitle="The occurrence tables could not be loaded">
      {(data) => (
        <Table
          caption="The department’s occurrence tables"
          hideCaption
          columns={columns}
          rows={data.tables}
          rowKey={(t) => t.id}
          initialSort={{ columnId: 'updated', direction: 'descending' }}
          stackOnNarrow
          empty={
            <EmptyState title="No occurrence tables yet" action={emptyAction}>
              A table lists companion classes by mass and period with the share of stars that host one, each row with its source.
            </EmptyState>
          }
        />
      )}
    </QueryState>
  );
}
