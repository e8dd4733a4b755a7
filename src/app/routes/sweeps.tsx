import { useNavigate, useSearchParams } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { listPriceCredits } from '../../../shared/contracts/pricing.ts';
import { Alert } from '../../components/ui/alert.tsx';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { SweepForm } from '../../features/sweeps/components/sweep-form.tsx';
import { SweepsTable } from '../../features/sweeps/components/sweeps-table.tsx';

/** The quote route answers for at most this many systems at once (one run's limit). */
const QUOTE_LIMIT = 1e10;

function SweepCost({ departmentId, systems, points }: { departmentId: string; systems: number | null; points: number | null }) {
  if (systems === null || points === null || !Number.isInteger(systems) || systems < 1e3) {
    return <p className="text-foam-300">The cost appears once the grid and the number of systems are set.</p>;
  }
  const list = listPriceCredits(systems) * points;
  return (
    <div className="flex flex-col gap-2">
      {systems * points > QUOTE_LIMIT ? (
        <Alert message="More than 10^10 systems in all: too large to quote at once. Make the grid or the runs smaller." />
      ) : (
        <RunCostNotice departmentId={departmentId} systems={systems} runs={points} />
      )}
      <p className="text-sm text-foam-400">
        At list price, with no free systems left: {list.toLocaleString('en-US')} credit{list === 1 ? '' : 's'} ({points} points × {listPriceCredits(systems)}; each point is charged as
        its own run, rounded up to whole credits). The whole grid is reserved when the sweep starts.
      </p>
    </div>
  );
}

export function Component() {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const canStart = roleAtLeast(me.role, 'modeller');
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Sweeps"
        description="One scenario across a grid of one or two parameters, with the same seed at every point, to see how the predicted fraction moves and which values an observed sample allows."
      />
      <div className="flex flex-col gap-6">
        {canStart ? (
          <Card title="New sweep" description="Every grid point is a run of the scenario with the parameter set to that value.">
            <SweepForm
              departmentId={me.department.id}
              initialScenarioId={search.get('scenario')}
              onStarted={(id) => navigate(paths.sweeps.detail.getHref(id))}
              renderCost={(systems, points) => <SweepCost departmentId={me.department.id} systems={systems} points={points} />}
            />
          </Card>
        ) : (
          <Alert tone="info" message="Sweeps are set up by modellers and admins. You can open every sweep of the department below and set it against any sample." />
        )}
        <SweepsTable departmentId={me.department.id} />
      </div>
    </>
  );
}
