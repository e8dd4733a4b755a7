import { useNavigate } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { listPriceCredits } from '../../../shared/contracts/pricing.ts';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { formatCredits } from '../../features/billing/components/amounts.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { useConstraintSets } from '../../features/constraints/api/get-constraint-sets.ts';
import { useFits } from '../../features/fits/api/get-fits.ts';
import { FitForm } from '../../features/fits/components/fit-form.tsx';
import { FitsList } from '../../features/fits/components/fits-list.tsx';
import { useScenarioChoices } from '../../lib/api/scenario-choices.ts';

function FitCost({ departmentId, systems, points }: { departmentId: string; systems: number | null; points: number | null }) {
  if (systems === null || points === null) return <p className="text-foam-300">The cost appears once the grid and the number of systems are set.</p>;
  const total = systems * points;
  return (
    <div className="flex flex-col gap-2">
      <RunCostNotice departmentId={departmentId} systems={total} runs={1} />
      <p className="text-sm text-foam-400">
        {points.toLocaleString('en-US')} grid points × {systems.toLocaleString('en-US')} systems, reserved at once as {total.toLocaleString('en-US')} systems (at list price {formatCredits(listPriceCredits(total))}); refunded if the fit fails or is cancelled.
      </p>
    </div>
  );
}

export function Component() {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const fits = useFits(me.department.id);
  const scenarios = useScenarioChoices(me.department.id);
  const sets = useConstraintSets(me.department.id);
  const canStart = roleAtLeast(me.role, 'modeller');
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Fits"
        description="Which parameter values do all the observations of a constraint set allow together? A posterior on a grid of 1–4 parameters, every point from the same draws."
      />
      <div className="flex flex-col gap-6">
        {canStart && scenarios.data && sets.data ? (
          <Card title="New fit" description="The likelihood is the constraint set's joint likelihood; the cost is shown first.">
            <FitForm
              departmentId={me.department.id}
              scenarios={scenarios.data.scenarios.map((s) => ({ value: s.id, label: s.name }))}
              constraintSets={sets.data.constraintSets.map((s) => ({ value: s.id, label: s.name }))}
              cost={(systems, points) => <FitCost departmentId={me.department.id} systems={systems} points={points} />}
              onCreated={(id) => navigate(paths.fits.detail.getHref(id))}
            />
          </Card>
        ) : null}
        <Card title="Recent fits">
          <FitsList fits={fits.data?.fits ?? []} hrefOf={(f) => (f.implied ? paths.impliedOccurrence.withFit(f.id) : paths.fits.detail.getHref(f.id))} />
        </Card>
      </div>
    </>
  );
}
