import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { ErrorState, errorMessage } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { usePacks } from '../api/get-packs.ts';
import { useStartCheckout } from '../api/start-checkout.ts';
import { formatCredits, formatMoney } from './amounts.ts';

/** The credit packs on sale; buying one goes to the payment page and comes back here. */
export function PacksPanel() {
  const packs = usePacks();
  const checkout = useStartCheckout();
  return (
    <Card title="Buy credit" description="A one-off payment; the credit is added as soon as the payment service confirms it.">
      <Alert message={checkout.isError ? errorMessage(checkout.error) : undefined} className={checkout.isError ? 'mb-4' : undefined} />
      {packs.isPending ? (
        <LoadingState label="Loading the packs…" />
      ) : packs.isError ? (
        <ErrorState error={packs.error} title="The packs could not be loaded" onRetry={() => void packs.refetch()} retrying={packs.isFetching} />
      ) : (
        <ul className="grid gap-3 sm:grid-cols-3">
          {packs.data.packs.map((pack) => (
            <li key={pack.id} className="flex flex-col gap-2 rounded-md border border-ink-600 p-4">
              <p className="text-xl font-bold text-foam-50">{formatCredits(pack.credits)}</p>
              <p className="text-foam-300">{formatMoney(pack.unitAmount, pack.currency)}</p>
              <Button
                className="mt-auto"
                pending={checkout.isPending && checkout.variables.packId === pack.id}
                disabled={checkout.isPending || checkout.isSuccess}
                onClick={() => checkout.mutate({ packId: pack.id })}
              >
                Buy {pack.credits.toLocaleString('en-GB')}
                <span className="sr-only"> credits for {formatMoney(pack.unitAmount, pack.currency)}</span>
              </Button>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
