import { Alert } from '../../../components/ui/alert.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { Spinner } from '../../../components/ui/spinner.tsx';
import { useQuote } from '../api/get-quote.ts';
import { formatCredits, formatCount } from './amounts.ts';

export interface RunCostNoticeProps {
  departmentId: string;
  /** The run's number of systems (null while the field holds no valid number). */
  systems: number | null;
  /** Several runs of `systems` each (a sweep's grid points). */
  runs?: number;
}

/**
 * What starting a run will cost, before it starts: credits, the free systems it uses, and the
 * balance after it; a warning when the balance is short (the server would answer 402).
 * Meant for the run-start and sweep forms: the route composes it beside them.
 */
export function RunCostNotice({ departmentId, systems, runs = 1 }: RunCostNoticeProps) {
  const total = systems === null ? null : systems * runs;
  const quote = useQuote(departmentId, total);
  if (total === null) return null;
  if (quote.isPending) {
    return (
      <p role="status" className="flex items-center gap-2 text-foam-300">
        <Spinner className="size-4" /> Working out the cost…
      </p>
    );
  }
  if (quote.isError) return <Alert message={errorMessage(quote.error)} />;
  const q = quote.data;
  // A sweep is quoted as one total; each point rounds up on its own, so it may cost a credit or two more.
  const perPoint = runs > 1 ? ` (${runs} runs of ${formatCount(systems!)}; each rounds up on its own)` : '';
  const body = (
    <>
      <p className="font-bold">
        {q.credits === 0 ? 'Free: covered by this month’s free systems' : `Costs about ${formatCredits(q.credits)}`}
        {perPoint}
      </p>
      <p className="text-foam-300">
        Uses {formatCount(q.freeSystemsUsed)} of {formatCount(q.freeSystemsLeft)} free systems left this month · balance {formatCredits(q.balance)}
        {q.sufficient ? `, ${formatCredits(q.balanceAfter)} after` : ''}.
      </p>
      {!q.sufficient && <p>The balance is short by {formatCredits(q.credits - q.balance)}: an admin can buy credit, or make the run smaller.</p>}
    </>
  );
  return <Alert tone={q.sufficient ? 'info' : 'danger'} message={body} />;
}
