import { useState } from 'react';
import { TOKEN_SCOPE_TEXT } from '../../../../shared/contracts/tokens.ts';
import type { TokenSummary } from '../../../../shared/contracts/tokens.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { formatDate, formatDateTimeUtc } from '../../../lib/format.ts';
import { useTokens } from '../api/get-tokens.ts';
import { useRevokeToken } from '../api/revoke-token.ts';
import { TOKEN_STATE_TEXT, maskedPrefix, tokenState } from './token-text.ts';

const when = (iso: string | null, none: string) => (iso ? <span className="whitespace-nowrap" title={formatDateTimeUtc(iso)}>{formatDate(iso)}</span> : <span className="text-foam-400">{none}</span>);

/** The user's tokens in this department, with their state, and a way to revoke each. */
export function TokensPanel({ departmentId, userId, departmentName }: { departmentId: string; userId: string; departmentName: string }) {
  const tokens = useTokens(departmentId, userId);
  const revoke = useRevokeToken(departmentId, userId);
  const [confirming, setConfirming] = useState<TokenSummary | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const now = new Date();

  const columns: TableColumn<TokenSummary>[] = [
    { id: 'name', header: 'Name', rowHeader: true, sortValue: (t) => t.name, cell: (t) => t.name },
    { id: 'scope', header: 'Scope', sortValue: (t) => t.scope, cell: (t) => TOKEN_SCOPE_TEXT[t.scope].label },
    { id: 'prefix', header: 'Starts with', cell: (t) => <code className="font-mono text-foam-300">{maskedPrefix(t.prefix)}</code> },
    {
      id: 'state',
      header: 'State',
      sortValue: (t) => tokenState(t, now),
      cell: (t) => {
        const state = TOKEN_STATE_TEXT[tokenState(t, now)];
        return (
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone={state.tone}>{state.label}</Badge>
            {t.revokedAt && <span className="text-sm whitespace-nowrap text-foam-300">{formatDate(t.revokedAt)}</span>}
          </span>
        );
      },
    },
    { id: 'created', header: 'Created', sortValue: (t) => new Date(t.createdAt), cell: (t) => when(t.createdAt, '') },
    { id: 'used', header: 'Last used', sortValue: (t) => (t.lastUsedAt ? new Date(t.lastUsedAt) : new Date(0)), cell: (t) => when(t.lastUsedAt, 'never') },
    { id: 'expires', header: 'Expires', sortValue: (t) => (t.expiresAt ? new Date(t.expiresAt) : new Date(8.64e15)), cell: (t) => when(t.expiresAt, 'never') },
    {
      id: 'actions',
      header: <span className="sr-only">Actions</span>,
      stackedLabel: false,
      align: 'end',
      cell: (t) =>
        tokenState(t, now) === 'revoked' ? null : (
          <Button
            variant="ghost"
            size="sm"
            className="text-coral-300"
            onClick={() => {
              revoke.reset();
              setNotice(null);
              setConfirming(t);
            }}
          >
            Revoke<span className="sr-only"> {t.name}</span>
          </Button>
        ),
    },
  ];

  return (
    <Card title="Your tokens" description={`Tokens act for you in ${departmentName}, with your role. “Last used” is updated at most once a minute.`}>
      <Alert tone="success" message={notice} className={notice ? 'mb-4' : undefined} />
      <QueryState query={tokens} loadingLabel="Loading tokens…" errorTitle="The tokens could not be loaded">
        {({ tokens: list }) => (
          <Table
            caption="Your API tokens"
            hideCaption
            columns={columns}
            rows={list}
            rowKey={(t) => t.id}
            initialSort={{ columnId: 'created', direction: 'descending' }}
            stackOnNarrow
            empty={<EmptyState title="No tokens yet">Create one above to use the API or the command line without a browser.</EmptyState>}
          />
        )}
      </QueryState>
      <ConfirmDialog
        open={confirming !== null}
        title={confirming ? `Revoke “${confirming.name}”?` : ''}
        confirmLabel="Revoke"
        tone="danger"
        pending={revoke.isPending}
        error={revoke.isError ? errorMessage(revoke.error) : undefined}
        onConfirm={() =>
          confirming &&
          revoke.mutate(confirming.id, {
            onSuccess: () => {
              setNotice(`“${confirming.name}” is revoked; requests with it are refused from now on.`);
              setConfirming(null);
            },
          })
        }
        onCancel={() => setConfirming(null)}
      >
        Scripts and machines that use this token stop working at once. This cannot be undone; you can create a new token instead.
      </ConfirmDialog>
    </Card>
  );
}
