import { Router } from 'express';
import { outboxMessageSchema, outboxResponseSchema, type OutboxMessage } from '../../../shared/contracts/account.ts';
import type { Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { AppError } from '../../lib/errors.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { departmentOf } from '../../lib/request-auth.ts';
import { membersOfDepartment } from '../departments/departments.repository.ts';
import { DEPARTMENT_HEADER } from './mailer.ts';

type StoredMessage = OutboxMessage & { headers?: Record<string, string> };

/**
 * The development outbox: what the local SMTP stand-in received, for admins, when DEV_OUTBOX_URL
 * is set. An admin sees only mail about their department or to its members, never another
 * department's invitations or anyone else's reset links.
 */
export function outboxRoutes(registry: RouteRegistry, config: Config, db: Db): Router {
  const router = Router();
  defineRoute(router, registry, '/api', {
    method: 'get', path: '/outbox', tag: 'Development', access: 'admin', response: outboxResponseSchema,
    summary: 'Mail the local SMTP stand-in received for your department (development only; off unless DEV_OUTBOX_URL is set)',
  }, async ({ auth }) => {
    if (!config.DEV_OUTBOX_URL) return { enabled: false, messages: [] };
    const department = departmentOf(auth);
    let stored: StoredMessage[];
    try {
      const res = await fetch(`${config.DEV_OUTBOX_URL.replace(/\/+$/, '')}/messages`, { signal: AbortSignal.timeout(3000) });
      stored = ((await res.json()) as { messages: StoredMessage[] }).messages;
    } catch (error) {
      throw new AppError({ code: 'outbox_unavailable', status: 502, message: `The local mail stand-in at ${config.DEV_OUTBOX_URL} did not answer; is it running (npm start starts it)?`, cause: error });
    }
    const members = new Set((await membersOfDepartment(db, department.id)).map((m) => m.email.toLowerCase()));
    const header = DEPARTMENT_HEADER.toLowerCase();
    const mine = stored.filter((m) => (m.headers?.[header] ? m.headers[header] === department.id : m.to.some((to) => members.has(to))));
    return { enabled: true, messages: mine.map((m) => outboxMessageSchema.parse(m)) };
  });
  return router;
}
