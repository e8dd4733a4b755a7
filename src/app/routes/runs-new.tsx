import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert.tsx';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { RunAgainForm } from '../../features/runs/components/run-again-form.tsx';
import { StartRunForm } from '../../features/runs/components/start-run-form.tsx';
import { formatCount } from '../../features/runs/components/run-text.ts';
import { systemsCapFor } from '../../features/runs/components/systems-cap.ts';

export function Component() {
  const me = useSignedInMe();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const [systems, setSystems] = useState<number | null>(null);
  const againId = search.get('again');
  const cap = systemsCapFor(me.role);
  const onStarted = (id: string) => navigate(paths.runs.detail.getHref(id));

  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.runs.getHref()}>Runs</Link>}
        title={againId ? 'Run again' : 'Start a run'}
        description="Draw a scenario’s population with a seed. The run is queued, shows its progress live, and keeps its own copy of the scenario."
      />
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <Card title="Run">
          {againId ? (
            <RunAgainForm departmentId={me.department.id} role={me.role} runId={againId} onSystemsChange={setSystems} onStarted={onStarted} />
          ) : (
            <StartRunForm departmentId={me.department.id} role={me.role} initialScenarioId={search.get('scenario')} onSystemsChange={setSystems} onStarted={onStarted} />
          )}
        </Card>
        <Card
          title="Cost"
          description={`Free systems this month are used first; beyond them a run costs credits, reserved when it is queued and given back if it fails or is cancelled.${cap === null ? '' : ` As an observer you may start runs of up to ${formatCount(cap)} systems.`}`}
        >
          {systems === null ? (
            <p className="text-foam-300">Enter a valid number of systems to see what the run costs.</p>
          ) : cap !== null && systems > cap ? (
            <Alert message={`Not allowed: ${formatCount(systems)} systems is above your limit of ${formatCount(cap)} per run as an observer. Make the run smaller, or ask a modeller.`} />
          ) : (
            <RunCostNotice departmentId={me.department.id} systems={systems} />
          )}
        </Card>
      </div>
    </>
  );
}
