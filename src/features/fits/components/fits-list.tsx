import { Link } from 'react-router-dom';
import type { FitSummary } from '../../../../shared/contracts/fits.ts';

/** The department's fits with status and progress (implied-occurrence questions among them). */
export function FitsList({ fits, hrefOf }: { fits: readonly FitSummary[]; hrefOf: (fit: FitSummary) => string }) {
  if (fits.length === 0) return <p className="text-foam-300">No fits yet.</p>;
  return (
    <ul className="flex flex-col gap-2">
      {fits.map((f) => (
        <li key={f.id}>
          <Link to={hrefOf(f)}>{f.name}</Link>{' '}
          <span className="text-sm text-foam-300">
            {f.status}
            {f.status === 'running' ? ` ${(100 * f.progress).toFixed(0)}%` : ''} · {f.parameters.join(' × ')} · {f.constraintSetName}
          </span>
        </li>
      ))}
    </ul>
  );
}
