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
import { formatDate, formatDateTimeUtc } from '../../../lib/format.ts';
import { useTokens } from '../api/get-tokens.ts';
import { useRevokeToken } from '../api/revoke-token.ts';
import { TOKEN_STATE_TEXT, maskedPrefix, tokenState } from './token-text.ts';

const when = (iso: string | null, none: string) => (iso ? <span className="whitespace-nowrap" title={formatDateTimeUtc(iso)}>{formatDate(iso)}</span> : <span className="text-foam-400">{none}</span>);

const DAY_MS = 86_400_000;

/**
 * One token as a slip: its name and what it may do, a line that empties as its lifetime runs
 * out, when it was made and last called, and (while it works) a way to revoke it.
 */
function TokenSlip({ token: t, now, onRevoke }: { token: TokenSummary; now: Date; onRevoke?: () => void }) {
  const state = tokenState(t, now);
  const text = TOKEN_STATE_TEXT[state];
  const created = new Date(t.createdAt).getTime();
  const expires = t.expiresAt ? new Date(t.expiresAt).getTime() : null;
  const left = expires === null ? null : Math.max(0, Math.min(1, (expires - now.getTime()) / Math.max(1, expires - created)));
  const daysLeft = expires === null ? null : Math.ceil((expires - now.getTime()) / DAY_MS);
  return (
    <li className={state === 'active' ? 'rounded-md border-l-4 border-kelp-300 bg-ink-900 p-4' : 'rounded-md border-l-4 border-ink-600 bg-ink-900 p-4 text-foam-300'}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-lg font-bold text-foam-50">{t.name}</p>
          <p className="text-sm text-foam-300">
            {TOKEN_SCOPE_TEXT[t.scope].label}: {TOKEN_SCOPE_TEXT[t.scope].allows}
          </p>
        </div>
        <div className="flex items-center gap-2">
          <Badge tone={text.tone}>{text.label}</Badge>
          {onRevoke && (
            <Button variant="ghost" size="sm" className="text-coral-300" onClick={onRevoke}>
              Revoke<span className="sr-only"> {t.name}</span>
            </Button>
          )}
        </div>
      </div>
      {state === 'active' && left !== null && (
        <div className="mt-3" role="img" aria-label={`${Math.round(left * 100)}% of its lifetime left`}>
          <div className="h-1.5 rounded-full bg-ink-700">
            <div className="h-1.5 rounded-full bg-kelp-300" style={{ width: `${left * 100}%` }} />
          </div>
        </div>
      )}
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-4">
        <div>
          <dt className="inline text-foam-400">Begins with </dt>
          <dd className="inline">
            <code className="font-mono">{maskedPrefix(t.prefix)}</code>
          </dd>
        </div>
        <div>
          <dt className="inline text-foam-400">Made </dt>
          <dd className="inline">{when(t.createdAt, '')}</dd>
        </div>
        <div>
          <dt className="inline text-foam-400">Last call </dt>
          <dd className="inline">{when(t.lastUsedAt, 'none yet')}</dd>
        </div>
        <div>
          <dt className="inline text-foam-400">{state === 'revoked' ? 'Revoked ' : 'Works until '}</dt>
          <dd className="inline">
            {state === 'revoked' ? when(t.revokedAt, '') : when(t.expiresAt, 'no end date')}
            {state === 'active' && daysLeft !== null && <span className="text-foam-400"> ({daysLeft === 1 ? '1 day' : `${daysLeft} days`} left)</span>}
          </dd>
        </div>
      </dl>
    </li>
  );
}

/** The user's tokens in this department, working ones first, and a way to revoke each. */
export function TokensPanel({ departmentId, userId, departmentName }: { departmentId: string; userId: string; departmentName: string }) {
  const tokens = useTokens(departmentId, userId);
  const revoke = useRevokeToken(departmentId, userId);
  const [confirming, setConfirming] = useState<TokenSummary | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const now = new Date();

  const askRevoke = (t: TokenSummary) => {
    revoke.reset();
    setNotice(null);
    setConfirming(t);
  };

  return (
    <Card title="Your tokens" description={`Tokens act for you in ${departmentName}, with your role. “Last used” is updated at most once a minute.`}>
      <Alert tone="success" message={notice} className={notice ? 'mb-4' : undefined} />
      <QueryState query={tokens} loadingLabel="Loading tokens…" errorTitle="The tokens could not be loaded">
        {({ tokens: list }) => {
          if (list.length === 0) return <EmptyState title="No tokens yet">Create one above to use the API or the command line without a browser.</EmptyState>;
          const newestFirst = [...list].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
          const working = newestFirst.filter((t) => tokenState(t, now) === 'active');
          const retired = newestFirst.filter((t) => tokenState(t, now) !== 'active');
          return (
            <div className="flex flex-col gap-5">
              {working.length === 0 ? (
                <p className="text-foam-300">None of your tokens works any more; create a new one above.</p>
              ) : (
                <ul aria-label="Tokens that work" className="flex flex-col gap-3">
                  {working.map((t) => (
                    <TokenSlip key={t.id} token={t} now={now} onRevoke={() => askRevoke(t)} />
                  ))}
                </ul>
              )}
              {retired.length > 0 && (
                <details className="rounded-md border border-ink-700 p-3">
                  <summary className="cursor-pointer font-bold text-foam-300">
                    No longer working ({retired.length})
                  </summary>
                  <ul aria-label="Tokens that no longer work" className="mt-3 flex flex-col gap-3">
                    {retired.map((t) => (
                      <TokenSlip key={t.id} token={t} now={now} />
                    ))}
                  </ul>
                </details>
              )}
            </div>
          );
        }}
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
