import { Router } from 'express';
import { sql } from 'drizzle-orm';
import { healthResponseSchema, type HealthResponse } from '../../../shared/contracts/auth.ts';
import type { Db } from '../../db/client.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { APP_VERSION } from '../../version.ts';

export function healthRoutes(registry: RouteRegistry, db: Db): Router {
  const router = Router();
  defineRoute(router, registry, '/api', {
    method: 'get', path: '/health', tag: 'Service', access: 'public',
    summary: 'Is the service up and is its database reachable?', response: healthResponseSchema,
  }, async ({ res }): Promise<HealthResponse> => {
    const started = performance.now();
    let database: HealthResponse['database'];
    try {
      await db.execute(sql`SELECT 1`);
      database = { reachable: true, latencyMs: Math.round((performance.now() - started) * 10) / 10 };
    } catch (error) {
      database = { reachable: false, error: error instanceof Error ? error.message : String(error) };
    }
    if (!database.reachable) res.status(503);
    return { status: database.reachable ? 'ok' : 'degraded', database, version: APP_VERSION, time: new Date().toISOString() };
  });
  return router;
}
