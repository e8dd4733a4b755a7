import { runProgressEventSchema, type RunProgressEvent } from '../../../../shared/contracts/runs.ts';
import { isFinalStatus } from './get-run.ts';

export interface RunEventHandlers {
  onProgress: (event: RunProgressEvent) => void;
  /** The stream could not be opened or broke off: the caller falls back to polling. */
  onFailure: () => void;
}

/**
 * Follows GET /api/runs/:id/events (server-sent events, event "progress"). The browser would
 * reconnect by itself after an error; here any error ends the stream instead, because the server
 * closes it when the run ends and polling is the better fallback for a broken one.
 * Returns the function that closes it.
 */
export function subscribeToRunEvents(id: string, handlers: RunEventHandlers): () => void {
  if (typeof EventSource === 'undefined') {
    handlers.onFailure();
    return () => undefined;
  }
  const source = new EventSource(`/api/runs/${encodeURIComponent(id)}/events`, { withCredentials: true });
  let closed = false;
  const close = () => {
    closed = true;
    source.close();
  };
  source.addEventListener('progress', (message) => {
    const parsed = runProgressEventSchema.safeParse(safeJson((message as MessageEvent<string>).data));
    if (!parsed.success) return;
    // The server ends the stream after a run's last event; closing first keeps that end from counting as a failure.
    if (isFinalStatus(parsed.data.status)) close();
    handlers.onProgress(parsed.data);
  });
  source.addEventListener('error', () => {
    if (closed) return;
    close();
    handlers.onFailure();
  });
  return close;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
