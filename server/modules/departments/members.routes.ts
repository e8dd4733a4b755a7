import { Router } from 'express';
import {
  changeRoleBodySchema,
  memberListResponseSchema,
  memberParamsSchema,
  memberSchema,
} from '../../../shared/contracts/members.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { MembersService } from './members.service.ts';

export function membersRoutes(registry: RouteRegistry, members: MembersService): Router {
  const router = Router();
  const mount = '/api/members';
  const tag = 'Members';

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'admin', tokenScope: 'never', summary: "List the department's members and their roles",
    response: memberListResponseSchema,
  }, async ({ auth }) => ({ members: await members.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'patch', path: '/:userId', tag, access: 'admin', summary: "Change a member's role (a department always keeps one admin)",
    params: memberParamsSchema, body: changeRoleBodySchema, response: memberSchema,
  }, ({ auth, params, body }) => members.changeRole(auth, params.userId, body.role));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/:userId', tag, access: 'admin', summary: 'Remove a member from the department',
    params: memberParamsSchema, status: 204,
  }, async ({ auth, params }) => {
    await members.remove(auth, params.userId);
  });

  return router;
}
