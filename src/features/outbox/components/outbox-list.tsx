import { useState } from 'react';
import type { OutboxMessage } from '../../../../shared/contracts/account.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { formatDate } from '../../../lib/format.ts';
import { useOutbox } from '../api/get-outbox.ts';

/** Links in the plain-text part, so that they can be followed from here. */
function Linked({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s]+)/g);
  return (
    <pre className="overflow-x-auto rounded-md bg-ink-900 p-4 font-mono text-sm whitespace-pre-wrap text-foam-50">
      {parts.map((part, i) => (/^https?:\/\//.test(part) ? <a key={i} href={part}>{part}</a> : part))}
    </pre>
  );
}

/** A message as an entry of the log: its subject opens it; the text part first, the HTML part on request. */
function Message({ message }: { message: OutboxMessage }) {
  const [html, setHtml] = useState(false);
  return (
    <li className="relative pl-6">
      {/* A mark on the log's line. */}
      <span aria-hidden="true" className="absolute top-2.5 left-[-5px] h-2.5 w-2.5 rounded-full bg-tide-300" />
      <details className="group">
        <summary className="cursor-pointer list-none">
          <span className="flex flex-wrap items-baseline gap-x-3">
            <span className="tabular-nums text-sm text-foam-400">{formatTimeUtc(message.receivedAt)}</span>
            <span className="font-bold text-foam-50 underline decoration-ink-500 decoration-1 underline-offset-3 group-open:decoration-foam-300">{message.subject}</span>
          </span>
          <span className="block text-sm text-foam-300">for {message.to.join(', ')}</span>
        </summary>
        <div className="mt-3">
          {html ? (
            // The HTML part in a sandboxed frame: no scripts, no same-origin access.
            <iframe title={`HTML part of ${message.subject}`} sandbox="" srcDoc={message.html} className="h-96 w-full rounded-md bg-foam-50" />
          ) : (
            <Linked text={message.text} />
          )}
          <Button variant="ghost" size="sm" className="mt-2" aria-pressed={html} onClick={() => setHtml((v) => !v)}>
            {html ? 'Back to the plain text' : 'See it as HTML'}
          </Button>
        </div>
      </details>
    </li>
  );
}

/** "14:05 UTC" of a timestamp (the day is the heading above it). */
function formatTimeUtc(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : `${date.toISOString().slice(11, 16)} UTC`;
}

/** Messages by the UTC day they arrived, newest day first, in the order given inside a day. */
function byDay(messages: readonly OutboxMessage[]): { day: string; messages: OutboxMessage[] }[] {
  const days = new Map<string, OutboxMessage[]>();
  for (const m of messages) {
    const day = m.receivedAt.slice(0, 10);
    days.set(day, [...(days.get(day) ?? []), m]);
  }
  return [...days.entries()].sort((a, b) => b[0].localeCompare(a[0])).map(([day, list]) => ({ day, messages: list }));
}

/** The development outbox: what Tidefield sent to the local mail stand-in, newest first. */
export function OutboxList({ departmentId }: { departmentId: string }) {
  const outbox = useOutbox(departmentId);
  if (outbox.isPending) return <LoadingState label="Reading the outbox…" />;
  if (outbox.isError) return <ErrorState error={outbox.error} title="The outbox could not be read" onRetry={() => void outbox.refetch()} retrying={outbox.isFetching} />;
  if (!outbox.data.enabled) {
    return <EmptyState title="The development outbox is off">This server sends e-mail through a real mail service (or DEV_OUTBOX_URL is empty), so your mail is in your own inbox.</EmptyState>;
  }
  return (
    <Card title="Mail log" description="Opened by its subject. Mail to you, and (for admins) this department's receipts and run notices, as the local SMTP stand-in received it. It is kept in memory until the stand-in stops.">
      {outbox.data.messages.length === 0 ? (
        <EmptyState title="No mail yet">Your reset links and run notices, and for admins the department's receipts and run notices, appear here.</EmptyState>
      ) : (
        <div className="flex flex-col gap-6">
          {byDay(outbox.data.messages).map(({ day, messages }) => (
            <section key={day} aria-label={formatDate(`${day}T12:00:00Z`)}>
              <h3 className="mb-3 font-bold text-foam-300">
                {formatDate(`${day}T12:00:00Z`)} <span className="font-normal text-foam-400">· {messages.length} message{messages.length === 1 ? '' : 's'}</span>
              </h3>
              <ul className="flex flex-col gap-4 border-l border-ink-600">
                {messages.map((m) => (
                  <Message key={m.id} message={m} />
                ))}
              </ul>
            </section>
          ))}
        </div>
      )}
    </Card>
  );
}
