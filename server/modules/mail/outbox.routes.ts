import { Router } from 'express';
import type { Logger } from 'pino';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { outboxMessageSchema, outboxResponseSchema, type OutboxMessage } from '../../../shared/contracts/account.ts';
import { devOutboxUrl, type Config } from '../../config.ts';
import { AppError } from '../../lib/errors.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';
import { DEPARTMENT_HEADER, KIND_HEADER } from './mailer.ts';

type StoredMessage = OutboxMessage & { headers?: Record<string, string> };

/**
 * Messages about a department that grant no access: an admin of that department may read
 * them. Every other kind (invitation and password-reset links, and any kind added later) is
 * shown to its recipient only, since reading it would let someone else act as them.
 */
export const DEPARTMENT_NOTICE_KINDS: ReadonlySet<string> = new Set(['receipt', 'run-finished', 'run-failed', 'sweep-finished']);

/** Whether the caller may read a message: their own mail, or (as admin) a notice about the active department. */
export function mayRead(auth: RequestAuth, message: StoredMessage): boolean {
  if (message.to.some((to) => to.toLowerCase() === auth.user.email.toLowerCase())) return true;
  const department = message.headers?.[DEPARTMENT_HEADER.toLowerCase()];
  const kind = message.headers?.[KIND_HEADER.toLowerCase()] ?? '';
  return Boolean(department && auth.department?.id === department && auth.role && roleAtLeast(auth.role, 'admin') && DEPARTMENT_NOTICE_KINDS.has(kind));
}

/**
 * The development outbox: what the local SMTP stand-in received. Each signed-in user reads the
 * mail sent to them; an admin also reads the department's notices (receipts, run and sweep notices),
 * never another person's access links. Off unless e-mail goes to the local stand-in.
 */
export function outboxRoutes(registry: RouteRegistry, config: Config, logger: Logger): Router {
  const router = Router();
  const outbox = devOutboxUrl(config);
  logger.info(
    outbox
      ? `Development outbox on: ${outbox} (mail goes to the local SMTP stand-in; each user reads their own mail at /outbox)`
      : 'Development outbox off (e-mail goes to a real mail server, or DEV_OUTBOX_URL is empty)',
  );
  defineRoute(router, registry, '/api', {
    method: 'get', path: '/outbox', tag: 'Development', access: 'signedIn', tokenScope: 'never', response: outboxResponseSchema,
    summary: 'Mail the local SMTP stand-in received for you, and (admins) your department\'s notices; off unless mail goes to the stand-in',
  }, async ({ auth }) => {
    if (!outbox) return { enabled: false, messages: [] };
    let stored: StoredMessage[];
    try {
      const res = await fetch(`${outbox}/messages`, { signal: AbortSignal.timeout(3000) });
      stored = ((await res.json()) as { messages: StoredMessage[] }).messages;
    } catch (error) {
      throw new AppError({ code: 'outbox_unavailable', status: 502, message: `The local mail stand-in at ${outbox} did not answer; is it running (npm start starts it)?`, cause: error });
    }
    return { enabled: true, messages: stored.filter((m) => mayRead(auth, m)).map((m) => outboxMessageSchema.parse(m)) };
  });
  return router;
}
