import { Router } from 'express';
import {
  meResponseSchema,
  signInBodySchema,
  switchDepartmentBodySchema,
} from '../../../shared/contracts/auth.ts';
import type { Config } from '../../config.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { bodyEmailKey, clientKey, limiter, minutesText } from '../../lib/rate-limit.ts';
import { toMe, type AuthService } from './auth.service.ts';
import type { SessionStore } from './session.ts';

/** Failed sign-ins per client address and e-mail, and per client address over all e-mails (spraying); a successful sign-in does not count. */
function signInLimiters(config: Config) {
  const windowMs = config.SIGN_IN_WINDOW_MINUTES * 60_000;
  return [
    limiter({
      name: 'signInClient', windowMs, limit: config.SIGN_IN_CLIENT_LIMIT, countFailuresOnly: true, key: clientKey,
      message: (m) => `Too many failed sign-in attempts from your network. Try again in ${minutesText(m)}.`,
    }),
    limiter({
      name: 'signIn', windowMs, limit: config.SIGN_IN_LIMIT, countFailuresOnly: true, key: (req) => `${clientKey(req)}|${bodyEmailKey(req)}`,
      message: (m) => `Too many failed sign-in attempts for this address. Try again in ${minutesText(m)}.`,
    }),
  ];
}

export function authRoutes(registry: RouteRegistry, config: Config, auth: AuthService, sessions: SessionStore): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Accounts';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/sign-in', tag, access: 'public',
    summary: 'Sign in with e-mail and password; sets the session cookie',
    body: signInBodySchema, response: meResponseSchema, before: signInLimiters(config),
  }, async ({ body, req, res }) => {
    const { session, me } = await auth.signIn(body);
    res.append('Set-Cookie', sessions.cookieFor(session, req.secure));
    return me;
  });

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/sign-out', tag, access: 'signedIn', status: 204,
    summary: 'End this session',
  }, async ({ auth: caller, req, res }) => {
    if (caller.sessionId) await auth.signOut(caller.sessionId);
    res.append('Set-Cookie', sessions.cookieFor(null, req.secure));
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/me', tag, access: 'signedIn',
    summary: 'The signed-in user, the active department and the role in it',
    response: meResponseSchema,
  }, ({ auth: caller }) => toMe(caller));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/me/department', tag, access: 'signedIn',
    summary: 'Switch the active department of this session',
    body: switchDepartmentBodySchema, response: meResponseSchema,
  }, ({ auth: caller, body }) => auth.switchDepartment(caller, body.departmentId));

  return router;
}
