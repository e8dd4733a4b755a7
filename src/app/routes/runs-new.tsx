import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { StartRunForm } from '../../features/runs/components/start-run-form.tsx';

export function Component() {
  const me = useSignedInMe();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const [systems, setSystems] = useState<number | null>(null);

  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.runs.getHref()}>Runs</Link>}
        title="Start a run"
        description="Draw a scenario’s population with a seed. The run is queued, shows its progress live, and keeps its own copy of the scenario."
      />
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <Card title="Run">
          <StartRunForm
            departmentId={me.department.id}
            role={me.role}
            initialScenarioId={search.get('scenario')}
            onSystemsChange={setSystems}
            onStarted={(id) => navigate(paths.runs.detail.getHref(id))}
          />
        </Card>
        <Card title="Cost" description="Free systems this month are used first; beyond them a run costs credits, reserved when it is queued and given back if it fails or is cancelled.">
          {systems === null ? (
            <p className="text-foam-300">Enter a valid number of systems to see what the run costs.</p>
          ) : (
            <RunCostNotice departmentId={me.department.id} systems={systems} />
          )}
        </Card>
      </div>
    </>
  );
}
