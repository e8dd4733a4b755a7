import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { createFitBodySchema, fitDetailSchema, fitListResponseSchema, fitSummarySchema } from '../../../shared/contracts/fits.ts';
import { idResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { FitsService } from './fits.service.ts';

export function fitsRoutes(registry: RouteRegistry, fitsService: FitsService): Router {
  const router = Router();
  const mount = '/api/fits';
  const tag = 'Fits';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'modeller', status: 201, tokenScope: 'run',
    summary: 'Queue a fit: the posterior over 1–4 parameters on a grid (≤ 10^4 points, one pass over the same draws) given a constraint set; credit is reserved for every grid point',
    body: createFitBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => fitsService.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'observer', summary: "The department's fits, newest first", response: fitListResponseSchema,
  }, async ({ auth }) => ({ fits: await fitsService.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id', tag, access: 'observer',
    summary: 'A fit: status, progress, and once finished the posterior (log-likelihood grid, marginals, 68/95% intervals, best point with its scorecard, warnings)',
    params: idParamsSchema, response: fitDetailSchema,
  }, ({ auth, params }) => fitsService.detail(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id/methods.txt', tag, access: 'observer',
    summary: "A fit's methods paragraph: the grid, the priors, the constraint set with its citations, the Monte Carlo size and the engine version",
    params: idParamsSchema, produces: 'text/plain',
  }, async ({ auth, params, res }) => {
    res.type('text/plain; charset=utf-8').send(await fitsService.methods(auth, params.id));
  });

  defineRoute(router, registry, mount, {
    method: 'post', path: '/:id/cancel', tag, access: 'observer', tokenScope: 'run',
    summary: "Cancel a queued or running fit (its owner, or a modeller): the whole reservation is refunded and the chunks computed so far are discarded (no posterior; it cannot be resumed); 409 once it has finished",
    params: idParamsSchema, response: fitSummarySchema,
  }, ({ auth, params }) => fitsService.cancel(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/:id/resume', tag, access: 'modeller', tokenScope: 'run',
    summary: 'Continue a failed fit from the grid chunks it computed (credit is reserved again for every grid point; the failed run was refunded)',
    params: idParamsSchema, response: fitSummarySchema,
  }, ({ auth, params }) => fitsService.resume(auth, params.id));

  return router;
}
