import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import {
  cloneScenarioBodySchema,
  createScenarioBodySchema,
  idResponseSchema,
  presetListResponseSchema,
  scenarioDetailSchema,
  scenarioListResponseSchema,
  scenarioVersionsResponseSchema,
  updateScenarioBodySchema,
  versionParamsSchema,
} from '../../../shared/contracts/scenarios-api.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { loadPresets } from './presets.ts';
import type { ScenariosService } from './scenarios.service.ts';

export function scenariosRoutes(registry: RouteRegistry, scenarios: ScenariosService): Router {
  const router = Router();
  const mount = '/api/scenarios';
  const tag = 'Scenarios';

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'observer', summary: "List the department's scenarios", response: scenarioListResponseSchema,
  }, async ({ auth }) => ({ scenarios: await scenarios.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/presets', tag, access: 'observer', summary: 'The example scenarios shipped with Tidefield', response: presetListResponseSchema,
  }, () => ({ presets: loadPresets() }));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'modeller', status: 201, summary: 'Create a scenario from a document (version 1)',
    body: createScenarioBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => scenarios.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id', tag, access: 'observer', summary: 'A scenario with its current document', params: idParamsSchema, response: scenarioDetailSchema,
  }, ({ auth, params }) => scenarios.detail(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'patch', path: '/:id', tag, access: 'modeller', summary: 'Rename a scenario and/or save a new version of its document',
    params: idParamsSchema, body: updateScenarioBodySchema, response: scenarioDetailSchema,
  }, ({ auth, params, body }) => scenarios.update(auth, params.id, body));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/:id', tag, access: 'modeller', status: 204, summary: 'Delete a scenario (its runs keep their snapshots)', params: idParamsSchema,
  }, async ({ auth, params }) => {
    await scenarios.remove(auth, params.id);
  });

  defineRoute(router, registry, mount, {
    method: 'post', path: '/:id/clone', tag, access: 'modeller', status: 201, summary: 'Copy a scenario into a new one',
    params: idParamsSchema, body: cloneScenarioBodySchema, response: idResponseSchema,
  }, ({ auth, params, body }) => scenarios.clone(auth, params.id, body.name));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id/versions', tag, access: 'observer', summary: 'Every saved version of a scenario, newest first',
    params: idParamsSchema, response: scenarioVersionsResponseSchema,
  }, async ({ auth, params }) => ({ versions: await scenarios.versions(auth, params.id) }));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id/versions/:version', tag, access: 'observer', summary: 'One saved version of a scenario',
    params: versionParamsSchema, response: scenarioDetailSchema,
  }, ({ auth, params }) => scenarios.detail(auth, params.id, params.version));

  return router;
}
