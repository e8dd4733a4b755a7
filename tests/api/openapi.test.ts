import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp();
});
afterAll(() => ctx.close());

describe('OpenAPI description', () => {
  it('is OpenAPI 3.1 and describes every registered route with its schemas', async () => {
    const res = await request(ctx.app).get('/api/openapi.json').expect(200);
    expect(res.body.openapi).toBe('3.1.0');
    for (const route of ctx.tidefield.registry.routes) {
      const path = route.fullPath.replace(/\/$/, '').replace(/:(\w+)/g, '{$1}');
      const op = res.body.paths[path]?.[route.method];
      expect(op, `${route.method.toUpperCase()} ${path}`).toBeTruthy();
      if (route.body) expect(op.requestBody, `${path} body`).toBeTruthy();
      for (const match of path.matchAll(/\{(\w+)\}/g)) {
        expect(op.parameters.some((p: { name: string; in: string }) => p.name === match[1] && p.in === 'path'), `${path} ${match[1]}`).toBe(true);
      }
    }
    const create = res.body.paths['/api/runs'].post;
    expect(create.requestBody.content['application/json'].schema.properties).toHaveProperty('scenarioId');
    expect(res.body.paths['/api/runs/{id}/comparison'].get.responses['200'].content['application/json'].schema.properties).toHaveProperty('splits');
  });
});
