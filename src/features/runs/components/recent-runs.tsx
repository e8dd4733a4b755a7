import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useRuns } from '../api/get-runs.ts';
import { RunStatusBadge } from './run-status-badge.tsx';
import { fractionText } from './runs-table.tsx';

/** The caller's latest runs (sweep points are listed under their sweep) with their status and answer. */
export function RecentRuns({ departmentId }: { departmentId: string }) {
  const runs = useRuns(departmentId, { owner: 'me', pageSize: 5, sort: 'createdAt', order: 'desc' });
  return (
    <Card title="Your recent runs" actions={<Link to={paths.runs.getHref()}>All runs</Link>}>
      <QueryState query={runs} loadingLabel="Loading your runs…" errorTitle="Your runs could not be loaded">
        {(data) =>
          data.runs.length === 0 ? (
            <p className="text-foam-300">
              You have not started a run yet. <Link to={paths.runs.new.getHref()}>Start one</Link> from any scenario of the department.
            </p>
          ) : (
            <ul className="flex flex-col divide-y divide-ink-700">
              {data.runs.map((run) => (
                <li key={run.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-2">
                  <span className="min-w-0">
                    <Link to={paths.runs.detail.getHref(run.id)} className="font-bold">
                      {run.scenarioName}
                    </Link>
                    <span className="block text-sm text-foam-400">{formatDateTimeUtc(run.createdAt)}</span>
                  </span>
                  <span className="flex items-center gap-3">
                    <span className="tabular-nums text-foam-300">{fractionText(run)}</span>
                    <RunStatusBadge status={run.status} progress={run.progress} />
                  </span>
                </li>
              ))}
            </ul>
          )
        }
      </QueryState>
    </Card>
  );
}
