import { Card } from '../../../components/ui/card.tsx';
import type { Role } from '../../../../shared/contracts/roles.ts';
import { useSweepExports } from '../api/get-sweep-exports.ts';
import { ShareLinkPanel } from './share-link-panel.tsx';

/** A sweep's curve as ECSV or VOTable, and a read-only link to the sweep. */
export function SweepExportsSection({ departmentId, role, sweepId }: { departmentId: string; role: Role; sweepId: string }) {
  const exports = useSweepExports(departmentId, sweepId);
  const base = `/api/sweeps/${encodeURIComponent(sweepId)}/export`;
  return (
    <Card title="Exports" description="The curve with units and provenance, and a link for a paper.">
      <ul className="flex flex-col gap-4">
        {exports.data?.tables.map((t) => (
          <li key={t.name} className="flex flex-col gap-1 border-l-2 border-ink-600 pl-4">
            <span className="font-bold text-foam-50">{t.title}</span>
            <span className="text-sm text-foam-400">{t.description}</span>
            <span className="flex gap-4">
              <a className="font-bold" href={`${base}?format=ecsv&table=${t.name}`} download>ECSV</a>
              <a className="font-bold" href={`${base}?format=votable&table=${t.name}`} download>VOTable</a>
            </span>
          </li>
        ))}
        {exports.isError && <li className="text-sm text-coral-300">{exports.error.message}</li>}
        <li className="flex flex-col gap-1 border-l-2 border-ink-600 pl-4">
          <span className="font-bold text-foam-50">Read-only link</span>
          <span className="text-sm text-foam-400">A link that shows this sweep's points to anyone who has it, without signing in; revoke it at any time.</span>
          <ShareLinkPanel departmentId={departmentId} role={role} kind="sweep" objectId={sweepId} />
        </li>
      </ul>
    </Card>
  );
}
