/**
 * Read-only share links: created by modellers for a finished run or a sweep, opened without
 * signing in (exactly that object, nothing of the department), stored hashed, listed and
 * revoked by the department, rate-limited; a revoked link answers 404.
 */
import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shareLinks } from '../../server/modules/shares/share-links.table.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
let observer: Awaited<ReturnType<typeof addMember>>;
let runId: string;
let scenarioId: string;

const secretOf = (url: string) => url.split('/shared/')[1];

beforeAll(async () => {
  ctx = await createTestApp({ SHARE_LINKS_PER_HOUR: 3 });
  owner = await signUp(ctx.app, { department: 'Citing Dept' });
  observer = await addMember(ctx, owner.me.department.id, 'observer');
  scenarioId = await createScenario(owner.agent, checkScenario({ systems: 5000, seed: 'shared-1' }));
  runId = (await owner.agent.post('/api/runs').send({ scenarioId }).expect(201)).body.id;
  await waitForRun(owner.agent, runId);
}, 120_000);
afterAll(() => ctx?.close());

describe('share links to a run', () => {
  it('opens the run read-only without signing in, with nothing else of the department, until revoked', async () => {
    const created = await owner.agent.post(`/api/runs/${runId}/share`).expect(201);
    const url = created.body.url as string;
    expect(url.startsWith(`${ctx.url}/shared/tfs_`)).toBe(true);
    const secret = secretOf(url);
    // 24 random bytes in base64url: 32 characters, 192 bits (the issue asks for at least 128).
    expect(secret).toMatch(/^tfs_[A-Za-z0-9_-]{32}$/);

    // Stored hashed: the row holds the sha256 of the secret, never the secret.
    const [row] = await ctx.database.db.select().from(shareLinks).where(eq(shareLinks.id, created.body.id));
    expect(row.secretHash).toBe(createHash('sha256').update(secret).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(secret.slice(4));

    const anonymous = request(ctx.app);
    const shared = await anonymous.get(`/api/shared/${secret}`).expect(200);
    const result = (await owner.agent.get(`/api/runs/${runId}/result`).expect(200)).body;
    expect(shared.body.kind).toBe('run');
    expect(shared.body.result).toEqual(result);
    expect(shared.body.run).toMatchObject({ id: runId, seed: 'shared-1', systems: 5000, scenarioHash: result.scenarioHash });
    expect(shared.body.methods).toContain(result.scenarioHash);
    expect(shared.body.exports.tables.map((t: { name: string }) => t.name)).toContain('wd-mass');
    // No members, no credit, no other objects.
    const body = JSON.stringify(shared.body);
    for (const hidden of ['ownerName', 'ownerUserId', 'costCredits', owner.email, 'Citing Dept', scenarioId]) expect(body).not.toContain(hidden);

    const ecsv = await anonymous.get(`/api/shared/${secret}/export?format=ecsv&table=wd-mass`).expect(200);
    expect(ecsv.text).toContain('# %ECSV 1.0');
    expect(ecsv.text).toContain('unit: solMass');
    const bib = await anonymous.get(`/api/shared/${secret}/references.bib`).buffer(true).expect(200);
    expect(bib.text).toContain('@article{Webbink1984');
    // The link reads the run only: the signed-in routes stay closed to an anonymous caller.
    await anonymous.get(`/api/runs/${runId}/result`).expect(401);

    const list = await observer.agent.get('/api/share-links').expect(200);
    const listed = list.body.links.find((l: { id: string }) => l.id === created.body.id);
    expect(listed).toMatchObject({ kind: 'run', objectId: runId, revokedAt: null, prefix: secret.slice(0, 10) });
    expect(listed.lastOpenedAt).not.toBeNull();
    expect(JSON.stringify(list.body)).not.toContain(secret);

    await observer.agent.delete(`/api/share-links/${created.body.id}`).expect(403);
    await owner.agent.delete(`/api/share-links/${created.body.id}`).expect(204);
    await owner.agent.delete(`/api/share-links/${created.body.id}`).expect(204);
    const gone = await anonymous.get(`/api/shared/${secret}`).expect(404);
    expect(gone.body.error.code).toBe('not_found');
    await anonymous.get(`/api/shared/${secret}/export?format=ecsv&table=wd-mass`).expect(404);
    const after = await owner.agent.get('/api/share-links').expect(200);
    expect(after.body.links.find((l: { id: string }) => l.id === created.body.id).revokedAt).not.toBeNull();
  });

  it('answers 404 for made-up and malformed links alike', async () => {
    await request(ctx.app).get(`/api/shared/tfs_${'A'.repeat(32)}`).expect(404);
    await request(ctx.app).get('/api/shared/not-a-link').expect(404);
    await request(ctx.app).get(`/api/shared/${'x'.repeat(101)}`).expect(400);
  });

  it('lets observers list but not create links', async () => {
    const res = await observer.agent.post(`/api/runs/${runId}/share`).expect(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('shares a sweep: its points without the ids of the runs behind them', async () => {
    const sweepId = (await owner.agent.post('/api/sweeps').send({ scenarioId, axes: [{ path: 'envelope.alpha', values: [0.1, 1] }] }).expect(201)).body.id;
    const { url } = (await owner.agent.post(`/api/sweeps/${sweepId}/share`).expect(201)).body;
    const shared = await request(ctx.app).get(`/api/shared/${secretOf(url)}`).expect(200);
    expect(shared.body.kind).toBe('sweep');
    expect(shared.body.sweep.points).toHaveLength(2);
    expect(shared.body.sweep.points[0]).not.toHaveProperty('runId');
    expect(shared.body.sweep).not.toHaveProperty('scenarioId');
    expect(shared.body.exports.tables.map((t: { name: string }) => t.name)).toEqual(['curve']);
    await request(ctx.app).get(`/api/shared/${secretOf(url)}/references.bib`).expect(404);
  });

  it('limits how many links a member creates per hour (SHARE_LINKS_PER_HOUR = 3 here)', async () => {
    const modeller = await addMember(ctx, owner.me.department.id, 'modeller');
    for (let i = 0; i < 3; i++) await modeller.agent.post(`/api/runs/${runId}/share`).expect(201);
    const refused = await modeller.agent.post(`/api/runs/${runId}/share`).expect(429);
    expect(refused.body.error.code).toBe('rate_limited');
    expect(refused.headers['retry-after']).toBeTruthy();
  });
});

describe('shared reads are rate-limited per address', () => {
  it('refuses the read after SHARED_READS_PER_MINUTE (3 here) with 429', async () => {
    const small = await createTestApp({ SHARED_READS_PER_MINUTE: 3 });
    try {
      for (let i = 0; i < 3; i++) await request(small.app).get(`/api/shared/tfs_${'B'.repeat(32)}`).expect(404);
      const refused = await request(small.app).get(`/api/shared/tfs_${'B'.repeat(32)}`).expect(429);
      expect(refused.body.error.code).toBe('rate_limited');
    } finally {
      await small.close();
    }
  });
});
