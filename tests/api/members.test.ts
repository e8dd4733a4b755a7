import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp();
});
afterAll(() => ctx.close());

describe('members', () => {
  it('lists members with their roles and lets an admin change a role', async () => {
    const owner = await signUp(ctx.app);
    const observer = await addMember(ctx, owner.me.department.id, 'observer');
    const list = await owner.agent.get('/api/members').expect(200);
    expect(list.body.members.map((m: { role: string }) => m.role).sort()).toEqual(['admin', 'observer']);
    const changed = await owner.agent.patch(`/api/members/${observer.userId}`).send({ role: 'modeller' }).expect(200);
    expect(changed.body).toMatchObject({ userId: observer.userId, role: 'modeller' });
    // The change applies to the member's next request.
    expect((await observer.agent.get('/api/me').expect(200)).body.role).toBe('modeller');
  });

  it('never leaves a department without an admin (demote or remove the last one → 409)', async () => {
    const owner = await signUp(ctx.app);
    const demote = await owner.agent.patch(`/api/members/${owner.me.user.id}`).send({ role: 'observer' }).expect(409);
    expect(demote.body.error.code).toBe('last_admin');
    await owner.agent.delete(`/api/members/${owner.me.user.id}`).expect(409);
    // With a second admin, the first may step down.
    const second = await addMember(ctx, owner.me.department.id, 'admin');
    await owner.agent.patch(`/api/members/${owner.me.user.id}`).send({ role: 'modeller' }).expect(200);
    await second.agent.delete(`/api/members/${owner.me.user.id}`).expect(204);
    expect((await owner.agent.get('/api/me').expect(200)).body).toMatchObject({ department: null, role: null });
    await owner.agent.get('/api/members').expect(403);
  });

  it('keeps one admin when two admins demote each other at the same time', async () => {
    const owner = await signUp(ctx.app);
    const second = await addMember(ctx, owner.me.department.id, 'admin');
    const [a, b] = await Promise.all([
      owner.agent.patch(`/api/members/${second.userId}`).send({ role: 'observer' }),
      second.agent.patch(`/api/members/${owner.me.user.id}`).send({ role: 'observer' }),
    ]);
    const statuses = [a.status, b.status].sort();
    // Row locks serialise the two; whichever runs second either sees the caller already demoted (403) or would remove the last admin (409).
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const list = await ctx.database.db.query.memberships.findMany();
    const admins = list.filter((m) => m.departmentId === owner.me.department.id && m.role === 'admin');
    expect(admins).toHaveLength(1);
  });

  it('rejects an unknown role naming the allowed ones', async () => {
    const owner = await signUp(ctx.app);
    const res = await owner.agent.patch(`/api/members/${owner.me.user.id}`).send({ role: 'wizard' }).expect(400);
    expect(res.body.error.field).toBe('role');
    expect(res.body.error.message).toMatch(/observer, modeller, admin/);
  });
});

describe('tenant isolation', () => {
  it("answers 404 for another department's member and lists only one's own", async () => {
    const a = await signUp(ctx.app, { department: 'Department A' });
    const b = await signUp(ctx.app, { department: 'Department B' });
    const bMember = await addMember(ctx, b.me.department.id, 'observer');
    await a.agent.patch(`/api/members/${bMember.userId}`).send({ role: 'admin' }).expect(404);
    await a.agent.delete(`/api/members/${b.me.user.id}`).expect(404);
    const list = await a.agent.get('/api/members').expect(200);
    expect(list.body.members.map((m: { userId: string }) => m.userId)).toEqual([a.me.user.id]);
    expect((await bMember.agent.get('/api/me').expect(200)).body.role).toBe('observer');
  });

  it('refuses to switch into a department one does not belong to', async () => {
    const a = await signUp(ctx.app);
    const b = await signUp(ctx.app);
    const res = await a.agent.post('/api/me/department').send({ departmentId: b.me.department.id }).expect(403);
    expect(res.body.error.code).toBe('not_a_member');
    await request(ctx.app).get('/api/members').expect(401);
  });
});
