/** Invitations by e-mail, from the message in the local SMTP stand-in to a membership with the right role. */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectSelfContained, linkToken } from '../support/billing.ts';
import { addMember, createTestApp, GOOD_PASSWORD, signUp, uniqueEmail, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
let admin: Awaited<ReturnType<typeof signUp>>;

beforeAll(async () => {
  ctx = await createTestApp();
  admin = await signUp(ctx.app, { name: 'Inez Admin', department: 'Invitation Dept' });
});
afterAll(() => ctx?.close());

const read = new Set<string>();

async function invite(email: string, role: 'observer' | 'modeller' | 'admin') {
  const res = await admin.agent.post('/api/invitations').send({ email, role }).expect(201);
  expect(res.body).toMatchObject({ email, role, emailed: true, invitedByName: 'Inez Admin' });
  // The newest invitation to the address: skip the ones already read.
  const message = await ctx.fakes.mail.waitFor((m) => m.to.includes(email) && m.headers['x-tidefield-message'] === 'invitation' && !read.has(m.id));
  read.add(message.id);
  return { id: res.body.id as string, token: linkToken(message, '/accept-invitation'), message };
}

describe('invitations', () => {
  it('take a new person from the e-mail link to a membership with the invited role', async () => {
    const email = uniqueEmail('newcomer');
    const { token, message } = await invite(email, 'modeller');
    expect(message.subject).toBe('Join Invitation Dept on Tidefield');
    expect(message.text).toContain(`${ctx.url}/accept-invitation?token=`);
    expect(message.text).toMatch(/as a modeller/);
    expectSelfContained(message);
    expect((await admin.agent.get('/api/invitations').expect(200)).body.invitations.map((i: { email: string }) => i.email)).toContain(email);

    const preview = await request(ctx.app).get(`/api/invitations/preview/${token}`).expect(200);
    expect(preview.body).toMatchObject({ departmentName: 'Invitation Dept', email, role: 'modeller' });

    const newcomer = request.agent(ctx.app);
    const missing = await newcomer.post('/api/invitations/accept').send({ token, name: 'New Person' }).expect(400);
    expect(missing.body.error.field).toBe('password');
    const accepted = await newcomer.post('/api/invitations/accept').send({ token, name: 'New Person', password: GOOD_PASSWORD }).expect(200);
    expect(accepted.body).toMatchObject({ user: { email, name: 'New Person' }, role: 'modeller', department: { id: admin.me.department.id } });
    // Signed in by the acceptance, as a modeller.
    expect((await newcomer.get('/api/me').expect(200)).body.role).toBe('modeller');
    await newcomer.post('/api/scenarios').send({}).expect(400);
    const members = (await admin.agent.get('/api/members').expect(200)).body.members;
    expect(members.find((m: { email: string }) => m.email === email)?.role).toBe('modeller');

    // The link works once.
    const reused = await request(ctx.app).post('/api/invitations/accept').send({ token, name: 'Someone Else', password: GOOD_PASSWORD }).expect(410);
    expect(reused.body.error).toMatchObject({ code: 'link_used', field: 'token' });
    await request(ctx.app).get(`/api/invitations/preview/${token}`).expect(410);
    expect((await admin.agent.get('/api/invitations').expect(200)).body.invitations.map((i: { email: string }) => i.email)).not.toContain(email);
  });

  it('let an existing account join after signing in as the invited address, and only that account', async () => {
    const other = await signUp(ctx.app, { name: 'Has Account', department: 'Elsewhere' });
    const { token } = await invite(other.email, 'observer');
    // Enumeration (issue 9, item 13): the preview answers alike for an address with and without an account.
    const fresh = await invite(uniqueEmail('no-account'), 'observer');
    const withAccount = (await request(ctx.app).get(`/api/invitations/preview/${token}`).expect(200)).body;
    const withoutAccount = (await request(ctx.app).get(`/api/invitations/preview/${fresh.token}`).expect(200)).body;
    expect(Object.keys(withAccount).sort()).toEqual(Object.keys(withoutAccount).sort());
    expect(withAccount).not.toHaveProperty('accountExists');
    const anonymous = await request(ctx.app).post('/api/invitations/accept').send({ token, name: 'X', password: GOOD_PASSWORD }).expect(409);
    expect(anonymous.body.error.message).toMatch(/sign in/);
    const stranger = await signUp(ctx.app);
    const wrong = await stranger.agent.post('/api/invitations/accept').send({ token }).expect(403);
    expect(wrong.body.error.message).toContain(other.email);

    const joined = await other.agent.post('/api/invitations/accept').send({ token }).expect(200);
    expect(joined.body).toMatchObject({ role: 'observer', department: { name: 'Invitation Dept' } });
    expect(joined.body.memberships.map((m: { departmentName: string }) => m.departmentName).sort()).toEqual(['Elsewhere', 'Invitation Dept']);
    const again = await admin.agent.post('/api/invitations').send({ email: other.email, role: 'admin' }).expect(409);
    expect(again.body.error.field).toBe('email');
  });

  it('refuse an expired link, and a link replaced by a newer invitation or withdrawn', async () => {
    const email = uniqueEmail('late');
    const first = await invite(email, 'observer');
    await ctx.database.pool.query('update invitations set expires_at = ? where id = ?', [new Date(Date.now() - 1000), first.id]);
    const expired = await request(ctx.app).post('/api/invitations/accept').send({ token: first.token, name: 'Late', password: GOOD_PASSWORD }).expect(410);
    expect(expired.body.error).toMatchObject({ code: 'link_expired' });
    expect(expired.body.error.message).toMatch(/7 days/);

    const second = await invite(email, 'observer');
    const third = await invite(email, 'modeller');
    expect((await request(ctx.app).get(`/api/invitations/preview/${second.token}`).expect(410)).body.error.code).toBe('link_revoked');
    await admin.agent.delete(`/api/invitations/${third.id}`).expect(204);
    expect((await request(ctx.app).get(`/api/invitations/preview/${third.token}`).expect(410)).body.error.code).toBe('link_revoked');
    await admin.agent.delete(`/api/invitations/${third.id}`).expect(404);
    expect((await request(ctx.app).get(`/api/invitations/preview/${'x'.repeat(43)}`).expect(404)).body.error.code).toBe('invalid_link');
  });

  it('are sent by admins only, with the field named on bad input', async () => {
    const modeller = await addMember(ctx, admin.me.department.id, 'modeller');
    await modeller.agent.post('/api/invitations').send({ email: uniqueEmail(), role: 'observer' }).expect(403);
    const bad = await admin.agent.post('/api/invitations').send({ email: uniqueEmail(), role: 'owner' }).expect(400);
    expect(bad.body.error.field).toBe('role');
    expect(bad.body.error.message).toMatch(/observer, modeller, admin/);
  });

  it('invitation sending is rate-limited per invited address and per department (issue 9, item 13)', async () => {
    const limited = await createTestApp({ INVITATION_LIMIT: 4 });
    try {
      const boss = await signUp(limited.app);
      const target = uniqueEmail('flooded');
      for (let i = 0; i < 3; i += 1) await boss.agent.post('/api/invitations').send({ email: target, role: 'observer' }).expect(201);
      const perAddress = await boss.agent.post('/api/invitations').send({ email: target, role: 'observer' }).expect(429);
      expect(perAddress.body.error.message).toMatch(/This address/);
      await boss.agent.post('/api/invitations').send({ email: uniqueEmail(), role: 'observer' }).expect(201);
      const perDepartment = await boss.agent.post('/api/invitations').send({ email: uniqueEmail(), role: 'observer' }).expect(429);
      expect(perDepartment.body.error.message).toMatch(/This department/);
      expect(perDepartment.headers['retry-after']).toBeDefined();
    } finally {
      await limited.close();
    }
  });
});
