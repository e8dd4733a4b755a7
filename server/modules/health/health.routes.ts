import { Router } from 'express';
import { sql } from 'drizzle-orm';
import { healthResponseSchema, type HealthResponse } from '../../../shared/contracts/auth.ts';
import type { Db } from '../../db/client.ts';
import { DATABASE_RETRY_AFTER_SECONDS } from '../../lib/errors.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { APP_VERSION } from '../../version.ts';

/**
 * The health check, mounted before authentication so that every caller gets the same answer:
 * 200 when the database answers, 503 with the same JSON shape (and Retry-After) when it does
 * not. The database's error text stays in the server log, never in this public answer.
 */
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
    } catch {
      database = { reachable: false };
    }
    if (!database.reachable) res.status(503).setHeader('Retry-After', String(DATABASE_RETRY_AFTER_SECONDS));
    return { status: database.reachable ? 'ok' : 'degraded', database, version: APP_VERSION, time: new Date().toISOString() };
  });
  return router;
}
