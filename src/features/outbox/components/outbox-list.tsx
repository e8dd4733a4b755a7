import { useState } from 'react';
import type { OutboxMessage } from '../../../../shared/contracts/account.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
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

function Message({ message }: { message: OutboxMessage }) {
  const [html, setHtml] = useState(false);
  return (
    <li className="rounded-md border border-ink-600 p-4">
      <p className="font-bold text-foam-50">{message.subject}</p>
      <p className="text-sm text-foam-300">
        To {message.to.join(', ')} · {formatDateTimeUtc(message.receivedAt)}
      </p>
      <div className="mt-3">
        {html ? (
          // The HTML part in a sandboxed frame: no scripts, no same-origin access.
          <iframe title={`HTML part of ${message.subject}`} sandbox="" srcDoc={message.html} className="h-96 w-full rounded-md bg-foam-50" />
        ) : (
          <Linked text={message.text} />
        )}
      </div>
      <Button variant="ghost" size="sm" className="mt-2" aria-pressed={html} onClick={() => setHtml((v) => !v)}>
        {html ? 'Show the plain-text part' : 'Show the HTML part'}
      </Button>
    </li>
  );
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
    <Card title="Messages" description="Mail to you, and (for admins) this department's receipts and run notices, as the local SMTP stand-in received it. It is kept in memory until the stand-in stops.">
      {outbox.data.messages.length === 0 ? (
        <EmptyState title="No mail yet">Your reset links and run notices, and for admins the department's receipts and run notices, appear here.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-4">
          {outbox.data.messages.map((m) => (
            <Message key={m.id} message={m} />
          ))}
        </ul>
      )}
    </Card>
  );
}
