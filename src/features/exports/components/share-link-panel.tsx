import { useState } from 'react';
import type { ShareKind } from '../../../../shared/contracts/shares.ts';
import { roleAtLeast, type Role } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { CopyButton } from '../../../components/ui/copy-button.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useCreateShareLink } from '../api/create-share-link.ts';
import { useShareLinks } from '../api/get-share-links.ts';
import { useRevokeShareLink } from '../api/revoke-share-link.ts';

/**
 * Read-only links to one run or sweep: modellers create them (the URL is shown once: only a hash
 * is kept) and revoke them; every member sees which links are open.
 */
export function ShareLinkPanel({ departmentId, role, kind, objectId }: { departmentId: string; role: Role; kind: ShareKind; objectId: string }) {
  const canShare = roleAtLeast(role, 'modeller');
  const links = useShareLinks(departmentId);
  const create = useCreateShareLink(departmentId, kind, objectId);
  const revoke = useRevokeShareLink(departmentId);
  const [created, setCreated] = useState<string | null>(null);
  const open = (links.data?.links ?? []).filter((l) => l.kind === kind && l.objectId === objectId && !l.revokedAt);

  return (
    <div className="flex flex-col gap-3">
      {canShare ? (
        <div>
          <Button variant="secondary" size="sm" pending={create.isPending} onClick={() => create.mutate(undefined, { onSuccess: (r) => setCreated(r.url) })}>
            Create a read-only link
          </Button>
        </div>
      ) : (
        <p className="text-sm text-foam-400">Modellers can create read-only links.</p>
      )}
      <Alert message={create.error?.message ?? revoke.error?.message} />
      {created && (
        <div className="flex flex-col gap-2 rounded-md border border-kelp-300/60 bg-kelp-300/10 p-3">
          <p className="text-sm text-foam-300">Copy it now: the link is shown only once. Anyone holding it sees this {kind}, read-only, and nothing else.</p>
          <code aria-label="Read-only link" className="break-all text-foam-50 select-all">{created}</code>
          <CopyButton text={created} label="Copy the link" />
        </div>
      )}
      {open.length > 0 && (
        <ul aria-label="Open read-only links" className="flex flex-col gap-2">
          {open.map((l) => (
            <li key={l.id} className="flex flex-wrap items-center justify-between gap-2 text-sm text-foam-300">
              <span>
                <code>{l.prefix}…</code> by {l.createdByName}, {formatDateTimeUtc(l.createdAt)}
                {l.lastOpenedAt ? `, last opened ${formatDateTimeUtc(l.lastOpenedAt)}` : ', not opened yet'}
              </span>
              {canShare && (
                <Button variant="secondary" size="sm" pending={revoke.isPending && revoke.variables === l.id} onClick={() => revoke.mutate(l.id)}>
                  Revoke {l.prefix}…
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
