import { Link } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useSweeps } from '../api/get-sweeps.ts';
import { SWEEP_STATUS_TEXT, pointsProgress } from './sweep-text.ts';

/** The department's latest sweeps with their status and how many points are done. */
export function RecentSweeps({ departmentId }: { departmentId: string }) {
  const sweeps = useSweeps(departmentId);
  return (
    <Card title="Recent sweeps" actions={<Link to={paths.sweeps.getHref()}>All sweeps</Link>}>
      <QueryState query={sweeps} loadingLabel="Loading sweeps…" errorTitle="The sweeps could not be loaded">
        {(data) =>
          data.sweeps.length === 0 ? (
            <p className="text-foam-300">No sweep yet. A sweep runs a scenario over a grid of one or two parameters and draws the answer as a curve or a heat map.</p>
          ) : (
            <ul className="flex flex-col divide-y divide-ink-700">
              {data.sweeps.slice(0, 5).map((sweep) => (
                <li key={sweep.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-2">
                  <span className="min-w-0">
                    <Link to={paths.sweeps.detail.getHref(sweep.id)} className="font-bold">
                      {sweep.name}
                    </Link>
                    <span className="block text-sm text-foam-400">{formatDateTimeUtc(sweep.createdAt)}</span>
                  </span>
                  <span className="flex items-center gap-3">
                    <span className="tabular-nums text-foam-300">{pointsProgress(sweep).text}</span>
                    <Badge tone={SWEEP_STATUS_TEXT[sweep.status].tone}>{SWEEP_STATUS_TEXT[sweep.status].label}</Badge>
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
