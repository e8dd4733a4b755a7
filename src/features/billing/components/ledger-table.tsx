import { useState } from 'react';
import type { LedgerEntry } from '../../../../shared/contracts/billing.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useLedger } from '../api/get-ledger.ts';
import { formatChange, formatCount } from './amounts.ts';

const columns: TableColumn<LedgerEntry>[] = [
  { id: 'at', header: 'When', cell: (e) => <span className="whitespace-nowrap">{formatDateTimeUtc(e.at)}</span> },
  { id: 'what', header: 'What', rowHeader: true, cell: (e) => e.description },
  { id: 'who', header: 'By', cell: (e) => e.actorName ?? '—' },
  { id: 'credits', header: 'Credits', align: 'end', cell: (e) => <span className="font-mono">{formatChange(e.credits)}</span> },
  { id: 'free', header: 'Free systems', align: 'end', cell: (e) => <span className="font-mono">{e.freeSystems === 0 ? '—' : formatChange(e.freeSystems)}</span> },
  { id: 'after', header: 'Balance after', align: 'end', cell: (e) => <span className="font-mono">{formatCount(e.balanceAfter)}</span> },
];

/** Every change of the department's credit, newest first (the ledger is never edited). */
export function LedgerTable({ departmentId }: { departmentId: string }) {
  const [page, setPage] = useState(1);
  const ledger = useLedger(departmentId, page);
  const pages = ledger.data ? Math.max(1, Math.ceil(ledger.data.page.total / ledger.data.page.pageSize)) : 1;
  return (
    <Card title="Ledger" description="Purchases, reservations when runs are queued, and what happens to them when runs end.">
      {ledger.isPending ? (
        <LoadingState label="Loading the ledger…" />
      ) : ledger.isError ? (
        <ErrorState error={ledger.error} title="The ledger could not be loaded" onRetry={() => void ledger.refetch()} retrying={ledger.isFetching} />
      ) : (
        <>
          <Table
            caption="Credit ledger"
            hideCaption
            columns={columns}
            rows={ledger.data.entries}
            rowKey={(e) => String(e.id)}
            stackOnNarrow
            empty={<EmptyState title="No credit changes yet">Buying a pack or starting a run adds the first entry.</EmptyState>}
          />
          {pages > 1 && (
            <nav aria-label="Ledger pages" className="mt-4 flex items-center gap-3">
              <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
                Newer
              </Button>
              <span className="text-foam-300">
                Page {page} of {pages}
              </span>
              <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => setPage((p) => p + 1)}>
                Older
              </Button>
            </nav>
          )}
        </>
      )}
    </Card>
  );
}
