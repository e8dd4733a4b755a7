import { Router } from 'express';
import {
  notificationSettingsSchema,
  passwordResetConfirmSchema,
  passwordResetRequestedSchema,
  passwordResetRequestSchema,
} from '../../../shared/contracts/account.ts';
import type { Config } from '../../config.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { bodyEmailKey, clientKey, limiter, minutesText } from '../../lib/rate-limit.ts';
import type { AccountService } from './account.service.ts';

/** Reset requests per client address and e-mail in the sign-in window (the same answer for known and unknown addresses). */
function resetLimiter(config: Config) {
  return limiter({
    name: 'passwordReset', windowMs: config.SIGN_IN_WINDOW_MINUTES * 60_000, limit: Math.max(1, Math.ceil(config.SIGN_IN_LIMIT / 2)),
    key: (req) => `${clientKey(req)}|${bodyEmailKey(req)}`,
    message: (m) => `Too many reset requests for this address. Try again in ${minutesText(m)}.`,
  });
}

export function accountRoutes(registry: RouteRegistry, config: Config, account: AccountService): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Accounts';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/password-reset', tag, access: 'public', status: 202,
    body: passwordResetRequestSchema, response: passwordResetRequestedSchema, before: [resetLimiter(config)],
    summary: 'E-mail a single-use link (valid for an hour) to choose a new password; the same answer whether or not the address has an account',
  }, ({ body }) => account.requestPasswordReset(body.email));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/password-reset/confirm', tag, access: 'public', status: 204, body: passwordResetConfirmSchema,
    summary: 'Set a new password with the link token; every session and API token of the account ends',
  }, async ({ body }) => {
    await account.confirmPasswordReset(body);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/me/notifications', tag, access: 'signedIn', tokenScope: 'never', response: notificationSettingsSchema,
    summary: 'Which e-mail notices you get (run finished, run failed)',
  }, ({ auth }) => account.notificationSettings(auth));

  defineRoute(router, registry, mount, {
    method: 'put', path: '/me/notifications', tag, access: 'signedIn', body: notificationSettingsSchema, response: notificationSettingsSchema,
    summary: 'Switch the run-finished and run-failed e-mails on or off',
  }, ({ auth, body }) => account.saveNotificationSettings(auth, body));

  return router;
}
