import { Router } from 'express';
import { meResponseSchema } from '../../../shared/contracts/auth.ts';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import {
  acceptInvitationBodySchema,
  createInvitationBodySchema,
  createInvitationResponseSchema,
  invitationListResponseSchema,
  invitationPreviewSchema,
  tokenParamsSchema,
} from '../../../shared/contracts/invitations.ts';
import type { Config } from '../../config.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { bodyEmailKey, limiter, minutesText } from '../../lib/rate-limit.ts';
import type { SessionStore } from '../auth/session.ts';
import type { InvitationsService } from './invitations.service.ts';

const INVITATIONS_PER_ADDRESS = 3;

/** Invitations per invited address over all departments, then per department, in an hour (a refusal of the first is not counted by the second). */
function invitationLimiters(config: Config) {
  const windowMs = 3_600_000;
  return [
    limiter({
      name: 'invitationsAddress', windowMs, limit: INVITATIONS_PER_ADDRESS, key: bodyEmailKey,
      message: (m) => `This address has been sent ${INVITATIONS_PER_ADDRESS} invitations in the last hour, the most allowed. Try again in ${minutesText(m)}.`,
    }),
    limiter({
      name: 'invitationsDepartment', windowMs, limit: config.INVITATION_LIMIT, key: (_req, res) => res.locals.auth?.department?.id ?? '',
      message: (m) => `This department has sent ${config.INVITATION_LIMIT} invitations in the last hour, the most allowed. Try again in ${minutesText(m)}.`,
    }),
  ];
}

export function invitationsRoutes(registry: RouteRegistry, config: Config, invitations: InvitationsService, sessions: SessionStore): Router {
  const router = Router();
  const mount = '/api/invitations';
  const tag = 'Members';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'admin', status: 201, body: createInvitationBodySchema, response: createInvitationResponseSchema,
    before: invitationLimiters(config),
    summary: 'Invite an address to the department with a role; the e-mailed link works once, for 7 days',
  }, ({ auth, body }) => invitations.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'admin', tokenScope: 'never', response: invitationListResponseSchema,
    summary: "The department's open invitations",
  }, async ({ auth }) => ({ invitations: await invitations.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/:id', tag, access: 'admin', status: 204, params: idParamsSchema,
    summary: 'Withdraw an open invitation (its link stops working)',
  }, async ({ auth, params }) => {
    await invitations.revoke(auth, params.id);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/preview/:token', tag, access: 'public', params: tokenParamsSchema, response: invitationPreviewSchema,
    summary: 'What an invitation link offers (department, role, address), before it is accepted',
  }, ({ params }) => invitations.preview(params.token));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/accept', tag, access: 'public', body: acceptInvitationBodySchema, response: meResponseSchema,
    summary: 'Accept an invitation: as the signed-in owner of the address, or with a name and password for a new account (signs you in)',
  }, async ({ body, req, res }) => {
    const { me, session } = await invitations.accept(body, res.locals.auth);
    if (session) res.append('Set-Cookie', sessions.cookieFor(session, req.secure));
    return me;
  });

  return router;
}
