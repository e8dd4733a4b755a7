import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { createTokenBodySchema, createTokenResponseSchema, tokenListResponseSchema } from '../../../shared/contracts/tokens.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { TokensService } from './tokens.service.ts';

export function tokensRoutes(registry: RouteRegistry, tokens: TokensService): Router {
  const router = Router();
  const mount = '/api/tokens';
  const tag = 'API tokens';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'observer', status: 201,
    summary: 'Create a personal API token for the active department, with the read or run scope (signed in only; the secret is shown once)',
    body: createTokenBodySchema, response: createTokenResponseSchema,
  }, ({ auth, body }) => tokens.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'observer', tokenScope: 'never', summary: 'List your API tokens (never their secrets)',
    response: tokenListResponseSchema,
  }, async ({ auth }) => ({ tokens: await tokens.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/:id', tag, access: 'observer', status: 204, summary: 'Revoke one of your API tokens (signed in only)',
    params: idParamsSchema,
  }, async ({ auth, params }) => {
    await tokens.revoke(auth, params.id);
  });

  return router;
}
