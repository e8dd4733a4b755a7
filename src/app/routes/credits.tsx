import { Link, useSearchParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { BalancePanel } from '../../features/billing/components/balance-panel.tsx';
import { CheckoutStatus } from '../../features/billing/components/checkout-status.tsx';
import { LedgerTable } from '../../features/billing/components/ledger-table.tsx';
import { PacksPanel } from '../../features/billing/components/packs-panel.tsx';
import { ReceiptsTable } from '../../features/billing/components/receipts-table.tsx';

export function Component() {
  const me = useSignedInMe();
  const [search] = useSearchParams();
  const checkoutId = search.get('checkout');
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Credits"
        description={
          <>
            Compute credit for heavy runs. Each month the department runs a number of systems free; beyond that a run costs
            one credit per 10,000,000 systems, reserved when it is queued and given back if it fails or is cancelled.{' '}
            <Link to={paths.outbox.getHref()}>Sent receipts are in the outbox</Link> when the local mail stand-in runs.
          </>
        }
      />
      {checkoutId && <CheckoutStatus departmentId={me.department.id} checkoutId={checkoutId} cancelled={search.has('cancelled')} />}
      <div className="flex flex-col gap-6">
        <div className="grid items-start gap-6 lg:grid-cols-[minmax(18rem,1fr)_2fr]">
          <BalancePanel departmentId={me.department.id} />
          <PacksPanel />
        </div>
        <LedgerTable departmentId={me.department.id} />
        <ReceiptsTable departmentId={me.department.id} />
      </div>
    </>
  );
}
