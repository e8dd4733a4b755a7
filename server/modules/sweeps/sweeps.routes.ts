import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { idResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { createSweepBodySchema, sweepDetailSchema, sweepListResponseSchema, sweepQuerySchema, sweepSummarySchema } from '../../../shared/contracts/sweeps.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { SweepsService } from './sweeps.service.ts';

export function sweepsRoutes(registry: RouteRegistry, sweeps: SweepsService): Router {
  const router = Router();
  const mount = '/api/sweeps';
  const tag = 'Sweeps';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'modeller', status: 201, tokenScope: 'run',
    summary: 'Queue a 1-D or 2-D grid over named parameters; every point is a run with the same seed',
    body: createSweepBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => sweeps.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'observer', summary: "The department's sweeps", response: sweepListResponseSchema,
  }, async ({ auth }) => ({ sweeps: await sweeps.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id', tag, access: 'observer', summary: 'A sweep\'s points (curve data), optionally against a sample\'s observed band',
    params: idParamsSchema, query: sweepQuerySchema, response: sweepDetailSchema,
  }, ({ auth, params, query }) => sweeps.detail(auth, params.id, query.sample));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/:id/cancel', tag, access: 'modeller', tokenScope: 'run', summary: "Cancel every point that has not finished (each point's reservation is refunded); 409 when none is left to cancel", params: idParamsSchema, response: sweepSummarySchema,
  }, ({ auth, params }) => sweeps.cancel(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/:id/resume', tag, access: 'modeller', tokenScope: 'run',
    summary: "Continue a failed sweep from the chunks its job computed (each point reserves its credit again; the failed points were refunded)",
    params: idParamsSchema, response: sweepSummarySchema,
  }, ({ auth, params }) => sweeps.resume(auth, params.id));

  return router;
}
