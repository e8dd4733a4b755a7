import { Link } from 'react-router-dom';
import type { ShareLinkSummary } from '../../../../shared/contracts/shares.ts';
import { roleAtLeast, type Role } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useShareLinks } from '../api/get-share-links.ts';
import { useRevokeShareLink } from '../api/revoke-share-link.ts';

/** Every read-only link of the department: what it shows, who made it, when it was last opened; modellers revoke. */
export function DepartmentShareLinks({ departmentId, role }: { departmentId: string; role: Role }) {
  const links = useShareLinks(departmentId);
  const revoke = useRevokeShareLink(departmentId);
  const canRevoke = roleAtLeast(role, 'modeller');
  return (
    <Card title="Read-only links" description="Links to runs and sweeps that anyone holding them can open without signing in. A revoked link answers “not found”.">
      <Alert message={revoke.error?.message} />
      <QueryState query={links} loadingLabel="Loading the links…" errorTitle="The links could not be loaded">
        {({ links: rows }) => (
          <Table<ShareLinkSummary>
            caption="Read-only links of the department"
            hideCaption
            rows={rows}
            rowKey={(l) => l.id}
            empty="No read-only links yet. Create one in a run's or sweep's Exports section."
            stackOnNarrow
            columns={[
              {
                id: 'object', header: 'Shows', rowHeader: true,
                cell: (l) => <Link to={l.kind === 'run' ? paths.runs.detail.getHref(l.objectId) : paths.sweeps.detail.getHref(l.objectId)}>{`${l.kind === 'run' ? 'Run' : 'Sweep'}: ${l.label}`}</Link>,
              },
              { id: 'prefix', header: 'Link', cell: (l) => <code>{l.prefix}…</code> },
              { id: 'by', header: 'Created by', cell: (l) => `${l.createdByName}, ${formatDateTimeUtc(l.createdAt)}` },
              { id: 'opened', header: 'Last opened', cell: (l) => (l.lastOpenedAt ? formatDateTimeUtc(l.lastOpenedAt) : 'never') },
              {
                id: 'state', header: 'State', stackedLabel: false,
                cell: (l) =>
                  l.revokedAt ? `revoked ${formatDateTimeUtc(l.revokedAt)}` : canRevoke ? (
                    <Button variant="secondary" size="sm" pending={revoke.isPending && revoke.variables === l.id} onClick={() => revoke.mutate(l.id)}>
                      Revoke {l.prefix}…
                    </Button>
                  ) : 'open',
              },
            ]}
          />
        )}
      </QueryState>
    </Card>
  );
}
