import { Router } from 'express';
import { meResponseSchema, signUpBodySchema } from '../../../shared/contracts/auth.ts';
import { signUpConfirmSchema, signUpRequestedSchema } from '../../../shared/contracts/sign-up.ts';
import type { Config } from '../../config.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { bodyEmailKey, clientKey, limiter, minutesText } from '../../lib/rate-limit.ts';
import type { SessionStore } from '../auth/session.ts';
import type { SignUpService } from './sign-up.service.ts';

const SIGN_UPS_PER_EMAIL = 3;

/** Sign-ups per client address and per e-mail address in an hour. */
function signUpLimiters(config: Config) {
  const windowMs = 3_600_000;
  return [
    limiter({
      name: 'signUpClient', windowMs, limit: config.SIGN_UP_LIMIT, key: clientKey,
      message: (m) => `Too many sign-ups from your network. Try again in ${minutesText(m)}.`,
    }),
    limiter({
      name: 'signUpEmail', windowMs, limit: SIGN_UPS_PER_EMAIL, key: bodyEmailKey,
      message: (m) => `Too many sign-ups for this e-mail address. Check your mail, or try again in ${minutesText(m)}.`,
    }),
  ];
}

/** Failed confirmations per client address in the sign-in window (a successful one does not count). */
function confirmLimiter(config: Config) {
  return limiter({
    name: 'signUpConfirm', windowMs: config.SIGN_IN_WINDOW_MINUTES * 60_000, limit: config.SIGN_IN_CLIENT_LIMIT, countFailuresOnly: true, key: clientKey,
    message: (m) => `Too many invalid sign-up links from your network. Try again in ${minutesText(m)}.`,
  });
}

export function signUpRoutes(registry: RouteRegistry, config: Config, signUp: SignUpService, sessions: SessionStore): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Accounts';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/sign-up', tag, access: 'public', status: 202,
    summary: 'Ask for an account and a department with you as its admin: a new address gets a link that creates them; the same answer whether or not the address has an account',
    body: signUpBodySchema, response: signUpRequestedSchema, before: signUpLimiters(config),
  }, ({ body }) => signUp.request(body));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/sign-up/confirm', tag, access: 'public', status: 201,
    summary: `Create the account and its department with the e-mailed link token (single use); signs you in`,
    body: signUpConfirmSchema, response: meResponseSchema, before: [confirmLimiter(config)],
  }, async ({ body, req, res }) => {
    const { session, me } = await signUp.confirm(body.token);
    res.append('Set-Cookie', sessions.cookieFor(session, req.secure));
    return me;
  });

  return router;
}
