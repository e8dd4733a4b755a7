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
  'POST /api/auth/sign-up/confirm': 'public',
  'POST /api/auth/sign-in': 'public',
  'POST /api/auth/sign-out': 'signedIn',
  'GET /api/me': 'signedIn',
  'POST /api/me/department': 'signedIn',
  'GET /api/members': 'admin',
  'PATCH /api/members/:userId': 'admin',
  'DELETE /api/members/:userId': 'admin',
  'GET /api/openapi.json': 'public',
  'POST /api/tokens': 'observer',
  'GET /api/tokens': 'observer',
  'DELETE /api/tokens/:id': 'observer',
  'GET /api/scenarios': 'observer',
  'GET /api/scenarios/presets': 'observer',
  'POST /api/scenarios': 'modeller',
  'GET /api/scenarios/:id': 'observer',
  'PATCH /api/scenarios/:id': 'modeller',
  'DELETE /api/scenarios/:id': 'modeller',
  'POST /api/scenarios/:id/clone': 'modeller',
  'GET /api/scenarios/:id/versions': 'observer',
  'GET /api/scenarios/:id/versions/:version': 'observer',
  'GET /api/occurrence-tables': 'observer',
  'POST /api/occurrence-tables': 'observer',
  'POST /api/occurrence-tables/preview': 'observer',
  'POST /api/occurrence-tables/upload': 'observer',
  'GET /api/occurrence-tables/:id': 'observer',
  'PATCH /api/occurrence-tables/:id': 'observer',
  'DELETE /api/occurrence-tables/:id': 'observer',
  'GET /api/occurrence-tables/:id/csv': 'observer',
  'GET /api/samples': 'observer',
  'POST /api/samples': 'observer',
  'GET /api/samples/:id': 'observer',
  'PUT /api/samples/:id': 'observer',
  'DELETE /api/samples/:id': 'observer',
  'POST /api/runs': 'observer',
  'GET /api/runs': 'observer',
  'GET /api/runs/:id': 'observer',
  'GET /api/runs/:id/events': 'observer',
  'POST /api/runs/:id/cancel': 'observer',
  'POST /api/runs/:id/resume': 'observer',
  'GET /api/workers': 'admin',
  'POST /api/runs/:id/again': 'observer',
  'DELETE /api/runs/:id': 'observer',
  'GET /api/runs/:id/result': 'observer',
  'GET /api/runs/:id/comparison': 'observer',
  'GET /api/runs/:id/implied-occurrence': 'observer',
  'GET /api/runs/:id/export.csv': 'observer',
  'GET /api/runs/:id/export.json': 'observer',
  'GET /api/runs/:id/methods.txt': 'observer',
  'GET /api/compare': 'observer',
  'POST /api/implied-occurrence': 'observer',
  'GET /api/implied-occurrence/:id': 'observer',
  'POST /api/sweeps': 'modeller',
  'GET /api/sweeps': 'observer',
  'GET /api/sweeps/:id': 'observer',
  'POST /api/sweeps/:id/cancel': 'modeller',
  'POST /api/sweeps/:id/resume': 'modeller',
  'POST /api/fits': 'modeller',
  'GET /api/fits': 'observer',
  'GET /api/fits/:id': 'observer',
  'GET /api/fits/:id/methods.txt': 'observer',
  'POST /api/fits/:id/cancel': 'observer',
  'POST /api/fits/:id/resume': 'modeller',
  // Credit: members see the balance and what a run would cost; only admins buy and read the ledger.
  'GET /api/billing/balance': 'observer',
  'GET /api/billing/quote': 'observer',
  'GET /api/billing/packs': 'observer',
  'POST /api/billing/checkout': 'admin',
  'GET /api/billing/checkouts/:id': 'admin',
  'GET /api/billing/receipts': 'admin',
  'GET /api/billing/ledger': 'admin',
  // Called by the payment service; the signature, not a session, is its credential.
  'POST /api/billing/webhook': 'public',
  'POST /api/auth/password-reset': 'public',
  'POST /api/auth/password-reset/confirm': 'public',
  'GET /api/me/notifications': 'signedIn',
  'PUT /api/me/notifications': 'signedIn',
  'PUT /api/me/name': 'signedIn',
  'POST /api/me/email-change': 'signedIn',
  'POST /api/auth/email-change/confirm': 'public',
  'PUT /api/me/password': 'signedIn',
  'GET /api/me/sessions': 'signedIn',
  'POST /api/me/sessions/sign-out-everywhere': 'signedIn',
  'POST /api/invitations': 'admin',
  'GET /api/invitations': 'admin',
  'DELETE /api/invitations/:id': 'admin',
  // The link token is the credential of these two.
  'GET /api/invitations/preview/:token': 'public',
  'POST /api/invitations/accept': 'public',
  // Constraint sets are observers' data, like samples; the evaluation and the two-sample test read only.
  'GET /api/constraint-sets': 'observer',
  'POST /api/constraint-sets': 'observer',
  'GET /api/constraint-sets/:id': 'observer',
  'PUT /api/constraint-sets/:id': 'observer',
  'DELETE /api/constraint-sets/:id': 'observer',
  'GET /api/constraint-library': 'observer',
  'GET /api/runs/:id/evaluation': 'observer',
  'POST /api/stats/two-sample': 'observer',
  // Exports in astronomers' formats and the references of a run.
  'GET /api/runs/:id/export': 'observer',
  'GET /api/runs/:id/references.bib': 'observer',
  'GET /api/sweeps/:id/export': 'observer',
  // Share links: modellers create and revoke, every member sees the list; the link's secret is the credential of /shared.
  'POST /api/runs/:id/share': 'modeller',
  'POST /api/sweeps/:id/share': 'modeller',
  'GET /api/share-links': 'observer',
  'DELETE /api/share-links/:id': 'modeller',
  'GET /api/shared/:token': 'public',
  'GET /api/shared/:token/export': 'public',
  'GET /api/shared/:token/references.bib': 'public',
  // Each user reads their own mail; admins also their department's notices.
  'GET /api/outbox': 'signedIn',
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
        if (allowed && (key === 'POST /api/auth/sign-out' || key === 'POST /api/me/sessions/sign-out-everywhere' || key.startsWith('DELETE '))) return;
        const url = path.replace(/:(\w+)/g, (_m, name: string) => (name === 'version' ? '1' : 'no-such-id'));
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
