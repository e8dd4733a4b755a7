/**
 * The local stand-in for a mail service: an SMTP server (the `smtp-server` package) that
 * accepts every message and keeps it in memory, plus a small HTTP endpoint listing them
 * (the app's development outbox reads it; tests read the messages directly).
 *
 * smtp-server's built-in certificate has expired, so STARTTLS is switched off here; nodemailer
 * then sends in plain text on loopback (and upgrades with STARTTLS against a real server).
 */
import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { OutboxMessage } from '../../shared/contracts/account.ts';
import { listenOn } from './listen.ts';
import { parseMessage } from './mime.ts';

export interface StoredMessage extends OutboxMessage {
  /** Every header of the message, names in lower case. */
  headers: Record<string, string>;
  raw: string;
}

export interface SmtpFake {
  host: string;
  smtpPort: number;
  /** Base address of the HTTP side: GET /messages lists the messages (newest first), DELETE empties it. */
  outboxUrl: string;
  messages(): StoredMessage[];
  clear(): void;
  /** Resolves with the first message (old or new) that matches, or rejects after `timeoutMs`. */
  waitFor(match: (message: StoredMessage) => boolean, timeoutMs?: number): Promise<StoredMessage>;
  close(): Promise<void>;
}

const MAX_MESSAGES = 500;
const MAX_SIZE = 5 * 1024 * 1024;

export async function startSmtpFake(options: { host?: string; smtpPort?: number; httpPort?: number } = {}): Promise<SmtpFake> {
  const host = options.host ?? '127.0.0.1';
  const stored: StoredMessage[] = [];
  const waiters = new Set<() => void>();

  const smtp = new SMTPServer({
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    size: MAX_SIZE,
    banner: 'Tidefield local mail stand-in',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', async () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        let parsed: Awaited<ReturnType<typeof parseMessage>>;
        try {
          parsed = await parseMessage(raw);
        } catch (error) {
          callback(error as Error);
          return;
        }
        stored.push({
          id: randomBytes(8).toString('hex'),
          receivedAt: new Date().toISOString(),
          from: parsed.from,
          to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          subject: parsed.subject,
          text: parsed.text,
          html: parsed.html,
          headers: Object.fromEntries(parsed.headers),
          raw,
        });
        if (stored.length > MAX_MESSAGES) stored.shift();
        for (const wake of waiters) wake();
        callback();
      });
    },
  });
  smtp.on('error', () => {
    // A client that drops the connection mid-message: nothing to keep. (Listening errors reject below.)
  });
  await listenOn(smtp.server, options.smtpPort ?? 0, host);
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const list = () => [...stored].reverse().map(({ raw: _raw, ...message }) => message);
  const web = http.createServer((req, res) => {
    if (req.url?.split('?')[0] !== '/messages') {
      res.writeHead(404, { 'content-type': 'application/json' }).end('{"error":"not found"}');
      return;
    }
    if (req.method === 'DELETE') stored.length = 0;
    res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify({ messages: list() }));
  });
  await listenOn(web, options.httpPort ?? 0, host);
  const httpPort = (web.address() as AddressInfo).port;

  return {
    host,
    smtpPort,
    outboxUrl: `http://${host}:${httpPort}`,
    messages: () => [...stored],
    clear: () => void (stored.length = 0),
    waitFor(match, timeoutMs = 10_000) {
      return new Promise((resolve, reject) => {
        const check = () => {
          const found = stored.find(match);
          if (!found) return false;
          waiters.delete(check);
          clearTimeout(timer);
          resolve(found);
          return true;
        };
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`no matching e-mail arrived within ${timeoutMs} ms (${stored.length} messages stored)`));
        }, timeoutMs);
        if (!check()) waiters.add(check);
      });
    },
    async close() {
      web.closeAllConnections();
      await Promise.all([new Promise<void>((r) => smtp.close(() => r())), new Promise<void>((r) => web.close(() => r()))]);
    },
  };
}
