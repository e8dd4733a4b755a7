import { Router } from 'express';
import { z } from 'zod';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { APP_VERSION } from '../../version.ts';
import { buildOpenApi } from './openapi.ts';

export function openApiRoutes(registry: RouteRegistry): Router {
  const router = Router();
  let cached: unknown;
  defineRoute(router, registry, '/api', {
    method: 'get', path: '/openapi.json', tag: 'Service', access: 'public',
    summary: 'This API described in OpenAPI 3.1, generated from the validating schemas', response: z.record(z.string(), z.unknown()),
  }, () => (cached ??= buildOpenApi(registry.routes, APP_VERSION)));
  return router;
}
