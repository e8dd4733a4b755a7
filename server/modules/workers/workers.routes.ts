import { Router } from 'express';
import { workersResponseSchema, type WorkersResponse } from '../../../shared/contracts/workers.ts';
import type { ChunkExecutor } from '../../engine-pool/chunk-executor.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';

/** The compute workers as the run executor sees them (department admins only). */
export function workersRoutes(registry: RouteRegistry, executor: ChunkExecutor): Router {
  const router = Router();
  defineRoute(router, registry, '/api', {
    method: 'get', path: '/workers', tag: 'Service', access: 'admin',
    summary: 'Connected compute workers: their threads and the jobs they have done', response: workersResponseSchema,
  }, async (): Promise<WorkersResponse> => ({ mode: executor.kind, workers: (await executor.workers?.()) ?? [] }));
  return router;
}
