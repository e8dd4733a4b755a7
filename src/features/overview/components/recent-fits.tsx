import { Link } from 'react-router-dom';
import { Badge, type BadgeTone } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useRecentFits, type RecentFit } from '../api/get-recent-fits.ts';

/** Where a fit's page is (the fits feature owns the route). */
const fitHref = (id: string) => `/fits/${encodeURIComponent(id)}`;

const STATUS: Record<string, { label: string; tone: BadgeTone }> = {
  queued: { label: 'Queued', tone: 'neutral' },
  running: { label: 'Running', tone: 'info' },
  succeeded: { label: 'Finished', tone: 'success' },
  failed: { label: 'Failed', tone: 'danger' },
  cancelled: { label: 'Cancelled', tone: 'warning' },
};

function FitStatus({ fit }: { fit: RecentFit }) {
  const text = STATUS[fit.status] ?? { label: fit.status.charAt(0).toUpperCase() + fit.status.slice(1), tone: 'neutral' as const };
  const percent = fit.status === 'running' && typeof fit.progress === 'number' ? ` ${Math.floor(fit.progress * 100)}%` : '';
  return (
    <Badge tone={text.tone}>
      {text.label}
      {percent}
    </Badge>
  );
}

/**
 * The department's latest fits with their status. Left out entirely while the server offers no
 * fits (or cannot say): the Overview is about the user's work, not about a missing feature.
 */
export function RecentFits({ departmentId }: { departmentId: string }) {
  const fits = useRecentFits(departmentId);
  if (!fits.data) return null;
  const list = fits.data.slice(0, 5);
  return (
    <Card title="Recent fits" description="Parameters fitted to a set of observed constraints.">
      {list.length === 0 ? (
        <p className="text-foam-300">No fit yet. A fit searches a scenario’s parameters for the values that best match a set of observed constraints.</p>
      ) : (
        <ul className="flex flex-col divide-y divide-ink-700">
          {list.map((fit) => (
            <li key={fit.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-2">
              <span className="min-w-0">
                <Link to={fitHref(fit.id)} className="font-bold">
                  {fit.scenarioName}
                  {fit.constraintSetName ? ` against ${fit.constraintSetName}` : ''}
                </Link>
                <span className="block text-sm text-foam-400">
                  {fit.parameters.length > 0 ? `${fit.parameters.length} parameter${fit.parameters.length === 1 ? '' : 's'} · ` : ''}
                  {formatDateTimeUtc(fit.createdAt)}
                </span>
              </span>
              <FitStatus fit={fit} />
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
