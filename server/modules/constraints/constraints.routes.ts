import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import {
  constraintLibraryResponseSchema,
  constraintSetBodySchema,
  constraintSetListResponseSchema,
  constraintSetQuerySchema,
  constraintSetSchema,
  evaluationResponseSchema,
  twoSampleBodySchema,
  twoSampleResponseSchema,
  type ConstraintSetBody,
} from '../../../shared/contracts/constraints.ts';
import { idResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { departmentOf } from '../../lib/request-auth.ts';
import type { RunsService } from '../runs/runs.service.ts';
import { twoSample, type ConstraintSetsService } from './constraint-sets.service.ts';

/** Constraint sets, the library of published constraints, a run's evaluation, and the two-sample test. */
export function constraintsRoutes(registry: RouteRegistry, sets: ConstraintSetsService, runs: Pick<RunsService, 'finishedResult'>): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Constraints';

  defineRoute(router, registry, mount, {
    method: 'get', path: '/constraint-sets', tag, access: 'observer', summary: "The department's constraint sets, and the library as the set \"library\"",
    response: constraintSetListResponseSchema,
  }, async ({ auth }) => ({ constraintSets: await sets.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/constraint-sets', tag, access: 'observer', status: 201,
    summary: 'Save a constraint set (fractions, masses, fields, cooling-age incidence, post-CE periods; lists as arrays or CSV text; library entries by libraryId)',
    body: constraintSetBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => sets.create(auth, body as ConstraintSetBody));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/constraint-sets/:id', tag, access: 'observer', summary: 'One constraint set with its versions', params: idParamsSchema, response: constraintSetSchema,
  }, ({ auth, params }) => sets.detail(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'put', path: '/constraint-sets/:id', tag, access: 'observer', summary: 'Save a new version of a constraint set (the library is read-only)',
    params: idParamsSchema, body: constraintSetBodySchema, response: constraintSetSchema,
  }, ({ auth, params, body }) => sets.update(auth, params.id, body as ConstraintSetBody));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/constraint-sets/:id', tag, access: 'observer', status: 204, summary: 'Delete a constraint set', params: idParamsSchema,
  }, async ({ auth, params }) => {
    await sets.remove(auth, params.id);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/constraint-library', tag, access: 'observer', summary: 'The read-only library of published constraints, each with its citation',
    response: constraintLibraryResponseSchema,
  }, () => sets.library());

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/evaluation', tag, access: 'observer',
    summary: 'Score a finished run against every constraint of a set: per constraint p, σ, log-likelihood, whether the Monte Carlo error limits it; jointly by Fisher\'s method',
    params: idParamsSchema, query: constraintSetQuerySchema, response: evaluationResponseSchema,
  }, async ({ auth, params, query }) => {
    const departmentId = departmentOf(auth).id;
    const { result } = await runs.finishedResult(departmentId, params.id);
    return { runId: params.id, ...(await sets.evaluate(departmentId, query.constraintSet, result)) };
  });

  defineRoute(router, registry, mount, {
    method: 'post', path: '/stats/two-sample', tag, access: 'observer',
    summary: "Can two observed samples share one magnetic fraction? Fisher's exact test, σ, and both Clopper–Pearson intervals",
    body: twoSampleBodySchema, response: twoSampleResponseSchema,
  }, ({ body }) => twoSample(body));

  return router;
}
