import type { Checkout } from '../../../../shared/contracts/billing.ts';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useReceipts } from '../api/get-receipts.ts';
import { formatCredits, formatMoney } from './amounts.ts';

const columns: TableColumn<Checkout>[] = [
  { id: 'receipt', header: 'Receipt', rowHeader: true, cell: (c) => <span className="font-mono">{c.receiptNumber}</span> },
  { id: 'paid', header: 'Paid', sortValue: (c) => new Date(c.paidAt ?? c.createdAt), cell: (c) => <span className="whitespace-nowrap">{c.paidAt ? formatDateTimeUtc(c.paidAt) : '—'}</span> },
  { id: 'pack', header: 'Credits', align: 'end', cell: (c) => formatCredits(c.credits) },
  { id: 'amount', header: 'Amount', align: 'end', cell: (c) => formatMoney(c.unitAmount, c.currency) },
  { id: 'by', header: 'Bought by', cell: (c) => c.createdByName },
];

/** Paid purchases; each receipt was also e-mailed to whoever bought it. */
export function ReceiptsTable({ departmentId }: { departmentId: string }) {
  const receipts = useReceipts(departmentId);
  return (
    <Card title="Receipts" description="Each receipt was also sent by e-mail to the admin who paid.">
      {receipts.isPending ? (
        <LoadingState label="Loading receipts…" />
      ) : receipts.isError ? (
        <ErrorState error={receipts.error} title="The receipts could not be loaded" onRetry={() => void receipts.refetch()} retrying={receipts.isFetching} />
      ) : (
        <Table
          caption="Receipts"
          hideCaption
          columns={columns}
          rows={receipts.data.receipts}
          rowKey={(c) => c.id}
          initialSort={{ columnId: 'paid', direction: 'descending' }}
          stackOnNarrow
          empty={<EmptyState title="No purchases yet">Bought packs appear here with their receipt numbers.</EmptyState>}
        />
      )}
    </Card>
  );
}
