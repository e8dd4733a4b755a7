import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { runImpliedOccurrenceSchema } from '../../../shared/contracts/comparison.ts';
import { impliedOccurrenceAnswerSchema, impliedOccurrenceBodySchema, impliedOccurrenceStartedSchema } from '../../../shared/contracts/implied-occurrence.ts';
import { sampleQuerySchema } from '../../../shared/contracts/runs.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { ImpliedService } from './implied.service.ts';

export function impliedRoutes(registry: RouteRegistry, implied: ImpliedService): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Implied occurrence';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/implied-occurrence', tag, access: 'observer', status: 201, tokenScope: 'read',
    summary:
      'Ask "what occurrence does this sample imply?" of a scenario: queues the one-parameter fit over companions.multiplier (credit reserved for every grid point); then read /implied-occurrence/{fitId}',
    body: impliedOccurrenceBodySchema, response: impliedOccurrenceStartedSchema,
  }, ({ auth, body }) => implied.start(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/implied-occurrence/:id', tag, access: 'observer',
    summary: 'The question\'s progress, then both answers: the exact-test confidence range of the multiplier (68%, 95%) and the fit\'s credible interval with its prior',
    params: idParamsSchema, response: impliedOccurrenceAnswerSchema,
  }, ({ auth, params }) => implied.answer(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/implied-occurrence', tag, access: 'observer',
    summary: 'The range of the companion-occurrence multiplier a sample allows (68% and 95%) by inverting the exact binomial test on the run\'s exact response',
    params: idParamsSchema, query: sampleQuerySchema, response: runImpliedOccurrenceSchema,
  }, ({ auth, params, query }) => implied.fromRun(auth, params.id, query.sample));

  return router;
}
