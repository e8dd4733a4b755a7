import { Link } from 'react-router-dom';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { Card } from '../../../components/ui/card.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { formatComputeTime, formatCount } from './run-text.ts';

const credits = (n: number) => `${formatCount(n)} credit${n === 1 ? '' : 's'}`;

/** What the run cost: a failed or cancelled run's reserved credits were given back in full (the ledger's refund entry). */
export function costText(run: Pick<RunSummary, 'status' | 'costCredits'>): string {
  if (run.costCredits === 0) return 'no credits (free systems)';
  if (run.status === 'failed' || run.status === 'cancelled') return `nothing: the ${credits(run.costCredits)} reserved were refunded`;
  if (run.status === 'queued' || run.status === 'running') return `${credits(run.costCredits)} reserved (refunded if the run fails or is cancelled)`;
  return credits(run.costCredits);
}

/** What reproduces the run and what it cost. */
export function RunDetails({ run }: { run: RunSummary }) {
  const items = [
    { term: run.sweepPoint ? 'Base scenario' : 'Scenario', description: <Link to={paths.scenarios.detail.getHref(run.scenarioId)}>{run.scenarioName}</Link> },
    { term: 'Version', description: `version ${run.scenarioVersion}` },
    { term: 'Scenario hash', description: <code className="font-mono text-sm break-all">{run.scenarioHash}</code> },
    { term: 'Seed', description: <code className="font-mono">{run.seed}</code> },
    { term: 'Systems', description: `${formatCount(run.systems)} primaries in ${formatCount(run.chunkCount)} chunks` },
    { term: 'Engine', description: <code className="font-mono text-sm">{run.engineVersion}</code> },
    { term: 'Started by', description: run.ownerName },
    { term: 'Queued', description: formatDateTimeUtc(run.createdAt) },
    { term: 'Started', description: run.startedAt ? formatDateTimeUtc(run.startedAt) : 'not yet' },
    { term: 'Finished', description: run.finishedAt ? formatDateTimeUtc(run.finishedAt) : 'not yet' },
    { term: 'Compute time', description: `${formatComputeTime(run.computeMs)}${run.resumes > 0 ? ` (resumed ${run.resumes} time${run.resumes === 1 ? '' : 's'} after a server restart)` : ''}` },
    { term: 'Cost', description: costText(run) },
  ];
  const point = run.sweepPoint;
  if (point) {
    items.splice(
      0,
      0,
      {
        term: 'Sweep',
        description: (
          <>
            point {point.number} of {point.pointCount} of <Link to={paths.sweeps.detail.getHref(point.sweepId)}>{point.sweepName}</Link>
          </>
        ),
      },
      {
        term: 'Point values',
        description: (
          <ul className="flex flex-col gap-0.5">
            {point.values.map((v) => (
              <li key={v.path}>
                {v.label} = <span className="tabular-nums font-bold">{v.value}</span>
                {v.unit && ` ${v.unit}`}
              </li>
            ))}
          </ul>
        ),
      },
    );
  } else if (run.sweepId) {
    items.splice(2, 0, { term: 'Sweep', description: <Link to={paths.sweeps.detail.getHref(run.sweepId)}>point {(run.sweepPointIndex ?? 0) + 1} of a sweep</Link> });
  }
  return (
    <Card title="Run details" description="The scenario hash, seed and engine version reproduce the counts exactly.">
      <DescriptionList items={items} />
    </Card>
  );
}
