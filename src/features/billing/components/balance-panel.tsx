import { Card } from '../../../components/ui/card.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { useBalance } from '../api/get-balance.ts';
import { formatCredits, formatCount } from './amounts.ts';

/** The department's credit and this month's free systems. */
export function BalancePanel({ departmentId, refetchInterval }: { departmentId: string; refetchInterval?: number | false }) {
  const balance = useBalance(departmentId, { refetchInterval });
  return (
    <Card title="Balance" description="Runs use the month's free systems first, then one credit per 10,000,000 systems.">
      {balance.isPending ? (
        <LoadingState label="Loading the balance…" />
      ) : balance.isError ? (
        <ErrorState error={balance.error} title="The balance could not be loaded" onRetry={() => void balance.refetch()} retrying={balance.isFetching} />
      ) : (
        <>
          <p className="text-3xl font-bold text-foam-50" data-testid="credit-balance">
            {formatCredits(balance.data.credits)}
          </p>
          <dl className="mt-4 flex flex-col gap-3">
            <div>
              <dt className="text-foam-400">Free systems left in {balance.data.period}</dt>
              <dd className="font-bold text-foam-50">
                {formatCount(balance.data.freeSystemsLeft)} <span className="font-normal text-foam-300">of {formatCount(balance.data.freeSystemsPerMonth)}</span>
              </dd>
            </div>
            <div>
              <dt className="text-foam-400">Held by unfinished runs</dt>
              <dd className="font-bold text-foam-50">{formatCredits(balance.data.reservedCredits)}</dd>
            </div>
          </dl>
        </>
      )}
    </Card>
  );
}
