import { Router, type Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import {
  meResponseSchema,
  signInBodySchema,
  signUpBodySchema,
  switchDepartmentBodySchema,
} from '../../../shared/contracts/auth.ts';
import type { Config } from '../../config.ts';
import { tooManyRequests } from '../../lib/errors.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { toMe, type AuthService } from './auth.service.ts';
import type { SessionStore } from './session.ts';

/** Failed sign-ins per client address and e-mail; a successful sign-in does not count. */
function signInLimiter(config: Config) {
  const windowMs = config.SIGN_IN_WINDOW_MINUTES * 60_000;
  return rateLimit({
    windowMs,
    limit: config.SIGN_IN_LIMIT,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req: Request) =>
      `${ipKeyGenerator(req.ip ?? '')}|${String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase()}`,
    handler: (req, _res, next) => {
      const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = Math.max(1, Math.ceil(((resetTime?.getTime() ?? Date.now() + windowMs) - Date.now()) / 1000));
      const minutes = Math.ceil(seconds / 60);
      next(tooManyRequests(`Too many failed sign-in attempts for this address. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, seconds));
    },
  });
}

export function authRoutes(registry: RouteRegistry, config: Config, auth: AuthService, sessions: SessionStore): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Accounts';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/sign-up', tag, access: 'public', status: 201,
    summary: 'Create an account and a department with you as its admin; signs you in',
    body: signUpBodySchema, response: meResponseSchema,
  }, async ({ body, req, res }) => {
    const { session, me } = await auth.signUp(body);
    res.append('Set-Cookie', sessions.cookieFor(session, req.secure));
    return me;
  });

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/sign-in', tag, access: 'public',
    summary: 'Sign in with e-mail and password; sets the session cookie',
    body: signInBodySchema, response: meResponseSchema, before: [signInLimiter(config)],
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
