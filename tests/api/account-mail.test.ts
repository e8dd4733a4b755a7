/** Password reset by e-mail and the run notices each user can switch off. */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectSelfContained, linkToken } from '../support/billing.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';
import { createTestApp, GOOD_PASSWORD, signUp, signUpWithoutMail, uniqueEmail, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp();
});
afterAll(() => ctx?.close());

const NEW_PASSWORD = 'a brand new passphrase';

async function requestReset(email: string) {
  return request(ctx.app).post('/api/auth/password-reset').send({ email }).expect(202);
}

describe('password reset', () => {
  it('answers the same whether or not the address has an account, and mails only a real one', async () => {
    const user = await signUp(ctx.app);
    const nobody = uniqueEmail('nobody');
    const known = await requestReset(user.email);
    const unknown = await requestReset(nobody);
    expect(known.body).toEqual(unknown.body);
    expect(known.headers['content-type']).toBe(unknown.headers['content-type']);
    await ctx.fakes.mail.waitFor((m) => m.to.includes(user.email) && m.subject === 'Reset your Tidefield password');
    await new Promise((r) => setTimeout(r, 300));
    expect(ctx.fakes.mail.messages().some((m) => m.to.includes(nobody))).toBe(false);
  });

  it('sets a new password once, ends the old sessions, and refuses the link afterwards', async () => {
    const user = await signUp(ctx.app);
    await requestReset(user.email);
    const message = await ctx.fakes.mail.waitFor((m) => m.to.includes(user.email) && m.subject === 'Reset your Tidefield password');
    expectSelfContained(message);
    expect(message.text).toMatch(/works once/);
    const token = linkToken(message, '/reset-password');

    const short = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: 'short' }).expect(400);
    expect(short.body.error.field).toBe('password');
    await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: NEW_PASSWORD }).expect(204);
    await user.agent.get('/api/me').expect(401);
    await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: GOOD_PASSWORD }).expect(401);
    await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: NEW_PASSWORD }).expect(200);

    const reused = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: 'yet another passphrase' }).expect(410);
    expect(reused.body.error).toMatchObject({ code: 'link_used', field: 'token' });
  });

  it('refuses an expired link and an unknown one', async () => {
    const user = await signUp(ctx.app);
    await requestReset(user.email);
    const message = await ctx.fakes.mail.waitFor((m) => m.to.includes(user.email) && m.subject === 'Reset your Tidefield password');
    await ctx.database.pool.query('update password_resets set expires_at = ? where user_id = ?', [new Date(Date.now() - 1000), user.me.user.id]);
    const expired = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token: linkToken(message, '/reset-password'), password: NEW_PASSWORD }).expect(410);
    expect(expired.body.error.code).toBe('link_expired');
    expect(expired.body.error.message).toMatch(/1 hour/);
    await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: GOOD_PASSWORD }).expect(200);
    const unknown = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token: 'A'.repeat(43), password: NEW_PASSWORD }).expect(404);
    expect(unknown.body.error.code).toBe('invalid_link');
  });
});

describe('run notices', () => {
  it('mails the owner when a run finishes, unless they switched it off', async () => {
    const user = await signUp(ctx.app);
    expect((await user.agent.get('/api/me/notifications').expect(200)).body).toEqual({ runFinished: true, runFailed: true });
    const scenarioId = await createScenario(user.agent, checkScenario({ systems: 2000 }), 'Notice check');
    const first = await user.agent.post('/api/runs').send({ scenarioId }).expect(201);
    expect((await waitForRun(user.agent, first.body.id)).status).toBe('succeeded');
    const notice = await ctx.fakes.mail.waitFor((m) => m.to.includes(user.email) && m.subject === 'Run finished: Notice check');
    expect(notice.text).toMatch(/Predicted magnetic fraction: /);

    const bad = await user.agent.put('/api/me/notifications').send({ runFinished: 'no', runFailed: true }).expect(400);
    expect(bad.body.error.field).toBe('runFinished');
    await user.agent.put('/api/me/notifications').send({ runFinished: false, runFailed: true }).expect(200);
    expect((await user.agent.get('/api/me/notifications').expect(200)).body).toEqual({ runFinished: false, runFailed: true });
    const second = await user.agent.post('/api/runs').send({ scenarioId, seed: 'quiet' }).expect(201);
    expect((await waitForRun(user.agent, second.body.id)).status).toBe('succeeded');
    await new Promise((r) => setTimeout(r, 500));
    expect(ctx.fakes.mail.messages().filter((m) => m.to.includes(user.email) && m.subject.startsWith('Run finished'))).toHaveLength(1);
  });

  it("outbox takeover (issue 9, item 1): no admin sees another person's reset or invitation link; each user reads their own mail", async () => {
    const { addMember } = await import('../support/test-app.ts');
    const a = await signUp(ctx.app);
    const b = await signUp(ctx.app);
    // The victim is a member of both departments; each department has its own admin.
    const victim = await addMember(ctx, a.me.department.id, 'observer');
    const { insertMembership } = await import('../../server/modules/departments/departments.repository.ts');
    await insertMembership(ctx.database.db, { userId: victim.userId, departmentId: b.me.department.id, role: 'modeller', createdAt: new Date() });
    const invitee = uniqueEmail('for-a');
    await a.agent.post('/api/invitations').send({ email: invitee, role: 'observer' }).expect(201);
    await requestReset(victim.email);
    const reset = await ctx.fakes.mail.waitFor((m) => m.to.includes(victim.email) && m.subject === 'Reset your Tidefield password');
    await ctx.fakes.mail.waitFor((m) => m.to.includes(invitee));
    const token = linkToken(reset, '/reset-password');

    // Neither admin (of either department of the victim) sees the reset link or the invitation link.
    for (const admin of [a, b]) {
      const outbox = (await admin.agent.get('/api/outbox').expect(200)).body;
      expect(outbox.enabled).toBe(true);
      const text = JSON.stringify(outbox.messages);
      expect(text).not.toContain(token);
      expect(text).not.toContain(victim.email);
      expect(text).not.toContain(invitee);
    }
    // The victim reads their own reset mail; another member of the department does not.
    const own = (await victim.agent.get('/api/outbox').expect(200)).body.messages;
    expect(own.map((m: { subject: string }) => m.subject)).toContain('Reset your Tidefield password');
    const colleague = await addMember(ctx, a.me.department.id, 'modeller');
    expect(JSON.stringify((await colleague.agent.get('/api/outbox').expect(200)).body.messages)).not.toContain(token);
  });

  it("shows an admin their department's notices (receipts, run notices) but never another department's", async () => {
    const a = await signUp(ctx.app);
    const b = await signUp(ctx.app);
    const scenarioId = await createScenario(a.agent, checkScenario({ systems: 2000 }), 'Outbox notice');
    const run = await a.agent.post('/api/runs').send({ scenarioId }).expect(201);
    expect((await waitForRun(a.agent, run.body.id)).status).toBe('succeeded');
    await ctx.fakes.mail.waitFor((m) => m.to.includes(a.email) && m.subject === 'Run finished: Outbox notice');
    const mine = (await a.agent.get('/api/outbox').expect(200)).body.messages.map((m: { subject: string }) => m.subject);
    expect(mine).toContain('Run finished: Outbox notice');
    const theirs = (await b.agent.get('/api/outbox').expect(200)).body.messages.map((m: { subject: string }) => m.subject);
    expect(theirs).not.toContain('Run finished: Outbox notice');
  });

  it('the outbox is off unless e-mail goes to the local stand-in', async () => {
    const hosted = await createTestApp({ SMTP_HOST: 'smtp.example.org' });
    try {
      const { agent } = await signUpWithoutMail(hosted);
      expect((await agent.get('/api/outbox').expect(200)).body).toEqual({ enabled: false, messages: [] });
    } finally {
      await hosted.close();
    }
  });
});
