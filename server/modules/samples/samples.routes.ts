import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { createSampleBodySchema, sampleListResponseSchema, sampleSchema, updateSampleBodySchema } from '../../../shared/contracts/samples.ts';
import { idResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { SamplesService } from './samples.service.ts';

export function samplesRoutes(registry: RouteRegistry, samples: SamplesService): Router {
  const router = Router();
  const mount = '/api/samples';
  const tag = 'Observed samples';

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'observer', summary: "The department's observed samples and the library of published constraints",
    response: sampleListResponseSchema,
  }, async ({ auth }) => ({ samples: await samples.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'observer', status: 201, summary: 'Record an observed sample: magnetic of total, optionally split by setting or mass bin',
    body: createSampleBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => samples.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id', tag, access: 'observer', summary: 'One sample with its Clopper–Pearson intervals', params: idParamsSchema, response: sampleSchema,
  }, ({ auth, params }) => samples.get(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'put', path: '/:id', tag, access: 'observer', summary: "Change one of the department's samples (library entries are read-only)",
    params: idParamsSchema, body: updateSampleBodySchema, response: sampleSchema,
  }, ({ auth, params, body }) => samples.update(auth, params.id, body));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/:id', tag, access: 'observer', status: 204, summary: "Delete one of the department's samples", params: idParamsSchema,
  }, async ({ auth, params }) => {
    await samples.remove(auth, params.id);
  });

  return router;
}
