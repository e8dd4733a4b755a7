import { Router } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { runComparisonResponseSchema, runComparisonSchema } from '../../../shared/contracts/comparison.ts';
import { scenarioResultSchema } from '../../../shared/contracts/result.ts';
import {
  compareQuerySchema,
  createRunBodySchema,
  runAgainBodySchema,
  runListQuerySchema,
  runListResponseSchema,
  runSummarySchema,
  sampleQuerySchema,
  type RunProgressEvent,
} from '../../../shared/contracts/runs.ts';
import { idResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { sendDownload } from '../../lib/csv.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { RunEvents } from './run-events.ts';
import type { RunsService } from './runs.service.ts';

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);
const HEARTBEAT_MS = 15_000;

export function runsRoutes(registry: RouteRegistry, runs: RunsService, events: RunEvents): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Runs';

  defineRoute(router, registry, mount, {
    method: 'post', path: '/runs', tag, access: 'observer', status: 201, tokenScope: 'run',
    summary: 'Queue a run of a scenario (observers: at most 10^6 systems)', body: createRunBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => runs.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs', tag, access: 'observer', summary: "The department's runs, paged, sorted and filtered",
    query: runListQuerySchema, response: runListResponseSchema,
  }, ({ auth, query }) => runs.list(auth, query));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id', tag, access: 'observer', summary: 'A run: status, progress, ETA and headline fraction', params: idParamsSchema, response: runSummarySchema,
  }, ({ auth, params }) => runs.detail(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/events', tag, access: 'observer', produces: 'text/event-stream',
    summary: 'Progress as server-sent events (event "progress"); the stream ends when the run does', params: idParamsSchema,
  }, async ({ auth, params, req, res }) => {
    const initial = await runs.detail(auth, params.id);
    res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
    const send = (event: RunProgressEvent) => res.write(`event: progress\ndata: ${JSON.stringify(event)}\n\n`);
    const { id, status, progress, chunksDone, chunkCount, etaSeconds, error } = initial;
    send({ id, status, progress, chunksDone, chunkCount, etaSeconds, error });
    if (FINAL.has(status)) return void res.end();
    const heartbeat = setInterval(() => res.write(': still here\n\n'), HEARTBEAT_MS);
    const unsubscribe = events.subscribe(params.id, (event) => {
      send(event);
      if (FINAL.has(event.status)) close();
    });
    function close() {
      clearInterval(heartbeat);
      unsubscribe();
      res.end();
    }
    req.on('close', close);
  });

  defineRoute(router, registry, mount, {
    method: 'post', path: '/runs/:id/cancel', tag, access: 'observer', tokenScope: 'run', summary: 'Cancel a queued or running run (its owner, or a modeller)', params: idParamsSchema, response: runSummarySchema,
  }, ({ auth, params }) => runs.cancel(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/runs/:id/resume', tag, access: 'observer', status: 201, params: idParamsSchema, response: idResponseSchema,
    summary: 'Continue a failed run from the chunks it computed, as a new run (its owner, or a modeller)',
  }, ({ auth, params }) => runs.resume(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/runs/:id/again', tag, access: 'observer', status: 201,
    summary: "Queue the run's own scenario document again (a sweep's point keeps its values), optionally with another size or seed",
    params: idParamsSchema, body: runAgainBodySchema, response: idResponseSchema,
  }, ({ auth, params, body }) => runs.again(auth, params.id, body));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/runs/:id', tag, access: 'observer', status: 204, summary: 'Delete one of your runs (admins: any)', params: idParamsSchema,
  }, async ({ auth, params }) => {
    await runs.remove(auth, params.id);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/result', tag, access: 'observer', summary: "The run's result document (the fields the CLI prints)", params: idParamsSchema, response: scenarioResultSchema,
  }, ({ auth, params }) => runs.result(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/comparison', tag, access: 'observer',
    summary: 'Set the run against an observed sample or published constraint: exact binomial test, sigma, intervals, per-setting tests',
    params: idParamsSchema, query: sampleQuerySchema, response: runComparisonSchema,
  }, ({ auth, params, query }) => runs.comparison(auth, params.id, query.sample));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/export.csv', tag, access: 'observer', summary: 'The result as CSV', params: idParamsSchema, produces: 'text/csv',
  }, async ({ auth, params, res }) => sendDownload(res, `tidefield-run-${params.id}.csv`, await runs.exportCsv(auth, params.id)));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/export.json', tag, access: 'observer', summary: 'The result document as a JSON file', params: idParamsSchema, produces: 'application/json',
  }, async ({ auth, params, res }) =>
    sendDownload(res, `tidefield-run-${params.id}.json`, JSON.stringify(await runs.result(auth, params.id), null, 2) + '\n'));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/methods.txt', tag, access: 'observer',
    summary: 'A methods paragraph citing every published method used, the engine version, scenario hash and seed', params: idParamsSchema, produces: 'text/plain',
  }, async ({ auth, params, res }) => {
    const text = await runs.methods(auth, params.id);
    res.type('text/plain; charset=utf-8').send(text);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/compare', tag, access: 'observer', summary: 'Two to four finished runs side by side on the same axes',
    query: compareQuerySchema, response: runComparisonResponseSchema,
  }, ({ auth, query }) => runs.compare(auth, query.runs));

  return router;
}
