/**
 * The full role × route matrix. EXPECTED_ACCESS is the product's access policy written out by
 * hand (it is the specification, not read from the code); the test checks that every route
 * the app registers appears here, and that every role gets exactly the answer the policy says.
 * A forbidden caller must be refused before any validation, so the requests send no body.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RegisteredRoute, RouteRegistry } from '../../server/lib/http.ts';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';

type Who = 'anonymous' | 'observer' | 'modeller' | 'admin';
type Minimum = 'public' | 'signedIn' | 'observer' | 'modeller' | 'admin';

export const EXPECTED_ACCESS: Record<string, Minimum> = {
  'GET /api/health': 'public',
  'POST /api/auth/sign-up': 'public',
  'POST /api/auth/sign-in': 'public',
  'POST /api/auth/sign-out': 'signedIn',
  'GET /api/me': 'signedIn',
  'POST /api/me/department': 'signedIn',
  'GET /api/members': 'admin',
  'PATCH /api/members/:userId': 'admin',
  'DELETE /api/members/:userId': 'admin',
};

const RANK: Record<Who, number> = { anonymous: -1, observer: 0, modeller: 1, admin: 2 };
const NEEDED: Record<Minimum, number> = { public: -1, signedIn: 0, observer: 0, modeller: 1, admin: 2 };

let ctx: TestContext;
const agents = {} as Record<Who, request.Agent>;

beforeAll(async () => {
  ctx = await createTestApp();
  const owner = await signUp(ctx.app);
  agents.admin = owner.agent;
  agents.modeller = (await addMember(ctx, owner.me.department.id, 'modeller')).agent;
  agents.observer = (await addMember(ctx, owner.me.department.id, 'observer')).agent;
  agents.anonymous = request.agent(ctx.app);
});
afterAll(() => ctx.close());

function routeKey(r: RegisteredRoute) {
  return `${r.method.toUpperCase()} ${r.fullPath.replace(/\/$/, '')}`;
}

describe('role × route matrix', () => {
  it('covers every registered route', () => {
    const registry: RouteRegistry = ctx.tidefield.registry;
    const registered = registry.routes.map(routeKey).sort();
    expect(registered).toEqual(Object.keys(EXPECTED_ACCESS).sort());
  });

  const whos: Who[] = ['anonymous', 'observer', 'modeller', 'admin'];
  for (const [key, minimum] of Object.entries(EXPECTED_ACCESS)) {
    for (const who of whos) {
      const allowed = RANK[who] >= NEEDED[minimum];
      it(`${key} as ${who} → ${allowed ? 'allowed' : who === 'anonymous' ? '401' : '403'}`, async () => {
        const [method, path] = key.split(' ') as [string, string];
        // Skip calls that would end the shared sessions; their access rule is still checked for refusals.
        if (allowed && (key === 'POST /api/auth/sign-out' || key.startsWith('DELETE '))) return;
        const url = path.replace(/:(\w+)/g, 'no-such-id');
        const res = await agents[who][method.toLowerCase() as 'get'](url);
        if (allowed) {
          expect([401, 403]).not.toContain(res.status);
        } else {
          expect(res.status).toBe(who === 'anonymous' ? 401 : 403);
          expect(res.body.error.code).toBe(who === 'anonymous' ? 'unauthenticated' : 'forbidden');
        }
      });
    }
  }
});
