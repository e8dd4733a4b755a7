import { Router } from 'express';
import { emailChangeBodySchema, emailChangeConfirmSchema, messageResponseSchema, passwordChangeBodySchema, profileBodySchema, sessionListSchema } from '../../../shared/contracts/settings.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { SessionStore } from '../auth/session.ts';
import type { SettingsService } from './settings.service.ts';

export function settingsRoutes(registry: RouteRegistry, settings: SettingsService, sessions: SessionStore): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Accounts';

  defineRoute(router, registry, mount, {
    method: 'put', path: '/me/name', tag, access: 'signedIn', summary: 'Change your name', body: profileBodySchema, response: messageResponseSchema,
  }, ({ auth, body }) => settings.rename(auth, body.name));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/me/email-change', tag, access: 'signedIn',
    summary: 'Ask to change your e-mail address (with your current password); a confirmation link goes to the new address',
    body: emailChangeBodySchema, response: messageResponseSchema,
  }, ({ auth, body }) => settings.requestEmailChange(auth, body));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/auth/email-change/confirm', tag, access: 'public',
    summary: 'Confirm a new e-mail address with the link sent to it', body: emailChangeConfirmSchema, response: messageResponseSchema,
  }, ({ body }) => settings.confirmEmailChange(body.token));

  defineRoute(router, registry, mount, {
    method: 'put', path: '/me/password', tag, access: 'signedIn',
    summary: 'Change your password (with the current one); every other session is signed out', body: passwordChangeBodySchema, response: messageResponseSchema,
  }, async ({ auth, body, req, res }) => {
    const { session, message } = await settings.changePassword(auth, body);
    if (auth.sessionId) res.append('Set-Cookie', sessions.cookieFor(session, req.secure));
    return { message };
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/me/sessions', tag, access: 'signedIn', summary: 'Your signed-in sessions', response: sessionListSchema,
  }, ({ auth }) => settings.list(auth));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/me/sessions/sign-out-everywhere', tag, access: 'signedIn', status: 204, summary: 'End every session of your account, this one included',
  }, async ({ auth, req, res }) => {
    await settings.signOutEverywhere(auth);
    res.append('Set-Cookie', sessions.cookieFor(null, req.secure));
  });

  return router;
}
