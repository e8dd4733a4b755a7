import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessions } from '../../server/modules/auth/sessions.table.ts';
import { users } from '../../server/modules/users/users.table.ts';
import { signUps } from '../../server/modules/sign-up/sign-ups.table.ts';
import { expectSelfContained, linkToken } from '../support/billing.ts';
import { GOOD_PASSWORD, SIGN_UP_SUBJECT, createTestApp, signUp, uniqueEmail, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp({ SIGN_IN_LIMIT: 3, SIGN_IN_WINDOW_MINUTES: 10 });
});
afterAll(() => ctx.close());

/** Asks for an account on `on`, opens the mailed link through `decorate`d requests, and returns the confirmation's response. */
async function confirmSignUp(on: TestContext, decorate: (r: request.Test) => request.Test) {
  const email = uniqueEmail();
  await decorate(request(on.app).post('/api/auth/sign-up')).send({ email, password: GOOD_PASSWORD, name: 'B', department: 'D' }).expect(202);
  const message = await on.fakes.mail.waitFor((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
  return decorate(request(on.app).post('/api/auth/sign-up/confirm')).send({ token: linkToken(message, '/confirm-sign-up') }).expect(201);
}

describe('sign-up', () => {
  it('creates the user, a department with the user as admin, and signs in', async () => {
    const { agent, email } = await signUp(ctx.app, { name: 'Ada', department: 'Nebula Lab' });
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.user.email).toBe(email);
    expect(me.body.department.name).toBe('Nebula Lab');
    expect(me.body.role).toBe('admin');
    expect(me.body.memberships).toHaveLength(1);
  });

  it('stores an argon2id hash, never the password', async () => {
    const { email } = await signUp(ctx.app);
    const [row] = await ctx.database.db.select().from(users).where(eq(users.email, email));
    expect(row!.passwordHash.startsWith('$argon2id$')).toBe(true);
    expect(row!.passwordHash).not.toContain(GOOD_PASSWORD);
  });

  it('sets an httpOnly, SameSite=Lax session cookie (not Secure over plain http)', async () => {
    const res = await confirmSignUp(ctx, (r) => r);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/tidefield_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('marks the cookie Secure behind https (trusted proxy)', async () => {
    const secureCtx = await createTestApp({ TRUST_PROXY: true });
    try {
      const res = await confirmSignUp(secureCtx, (r) => r.set('X-Forwarded-Proto', 'https'));
      expect(String(res.headers['set-cookie'])).toMatch(/Secure/);
    } finally {
      await secureCtx.close();
    }
  });

  it('refuses a short password naming the field and the rule', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password: 'short', name: 'A', department: 'D' })
      .expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_input', field: 'password' });
    expect(res.body.error.message).toMatch(/at least 10 characters/);
  });

  it('answers a known address exactly as a new one (status, headers, body); the mail tells them apart', async () => {
    const { email, me } = await signUp(ctx.app);
    const fresh = uniqueEmail('fresh');
    const ask = (address: string) => request(ctx.app).post('/api/auth/sign-up').send({ email: address, password: GOOD_PASSWORD, name: 'A', department: 'D' });
    const known = await ask(email.toUpperCase());
    const unknown = await ask(fresh);
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    expect(known.body.message).toMatch(/Check your mail/);
    expect(known.headers['content-type']).toBe(unknown.headers['content-type']);
    expect(known.headers['set-cookie']).toBeUndefined();
    expect(unknown.headers['set-cookie']).toBeUndefined();

    // The known address gets a note pointing to sign-in and password reset, and no account link.
    const note = await ctx.fakes.mail.waitFor((m) => m.to.includes(email) && m.subject === 'You already have a Tidefield account');
    expectSelfContained(note);
    expect(note.text).toContain(`${ctx.url}/forgot-password`);
    expect(note.text).not.toMatch(/confirm-sign-up/);
    await ctx.fakes.mail.waitFor((m) => m.to.includes(fresh) && m.subject === SIGN_UP_SUBJECT);
    // No second account, and the first one's password and department are untouched.
    expect(await ctx.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
    const again = request.agent(ctx.app);
    await again.post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(200);
    expect((await again.get('/api/me').expect(200)).body.department.id).toBe(me.department.id);
  });

  it('no account exists until the link is opened; the link works once', async () => {
    const email = uniqueEmail('once');
    await request(ctx.app).post('/api/auth/sign-up').send({ email, password: GOOD_PASSWORD, name: 'Once', department: 'Once Lab' }).expect(202);
    const message = await ctx.fakes.mail.waitFor((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
    expectSelfContained(message);
    expect(message.text).toMatch(/works once/);
    await request(ctx.app).post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(401);
    // Only the token's SHA-256 is stored, never the token or the password.
    const token = linkToken(message, '/confirm-sign-up');
    const [pending] = await ctx.database.db.select().from(signUps).where(eq(signUps.email, email));
    expect(pending!.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(pending!.passwordHash.startsWith('$argon2id$')).toBe(true);

    const confirmed = await request(ctx.app).post('/api/auth/sign-up/confirm').send({ token }).expect(201);
    expect(confirmed.body).toMatchObject({ user: { email, name: 'Once' }, department: { name: 'Once Lab' }, role: 'admin' });
    await request(ctx.app).post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(200);
    const reused = await request(ctx.app).post('/api/auth/sign-up/confirm').send({ token }).expect(410);
    expect(reused.body.error).toMatchObject({ code: 'link_used', field: 'token' });
    expect(await ctx.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it('refuses an expired link and an unknown one, naming the token field', async () => {
    const email = uniqueEmail('late');
    await request(ctx.app).post('/api/auth/sign-up').send({ email, password: GOOD_PASSWORD, name: 'Late', department: 'D' }).expect(202);
    const message = await ctx.fakes.mail.waitFor((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
    await ctx.database.pool.query('update sign_ups set expires_at = ? where email = ?', [new Date(Date.now() - 1000), email]);
    const expired = await request(ctx.app).post('/api/auth/sign-up/confirm').send({ token: linkToken(message, '/confirm-sign-up') }).expect(410);
    expect(expired.body.error).toMatchObject({ code: 'link_expired', field: 'token' });
    expect(expired.body.error.message).toMatch(/24 hours/);
    await request(ctx.app).post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(401);
    const unknown = await request(ctx.app).post('/api/auth/sign-up/confirm').send({ token: 'x'.repeat(43) }).expect(404);
    expect(unknown.body.error).toMatchObject({ code: 'invalid_link', field: 'token' });
  });

  it('two pending sign-ups of one address make one account: the second link is refused', async () => {
    const email = uniqueEmail('twice');
    const ask = () => request(ctx.app).post('/api/auth/sign-up').send({ email, password: GOOD_PASSWORD, name: 'Twice', department: 'D' }).expect(202);
    await ask();
    await ctx.fakes.mail.waitFor((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
    await ask();
    await expect.poll(() => ctx.fakes.mail.messages().filter((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT).length).toBe(2);
    const [first, second] = ctx.fakes.mail.messages().filter((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
    await request(ctx.app).post('/api/auth/sign-up/confirm').send({ token: linkToken(first!, '/confirm-sign-up') }).expect(201);
    const refused = await request(ctx.app).post('/api/auth/sign-up/confirm').send({ token: linkToken(second!, '/confirm-sign-up') }).expect(409);
    expect(refused.body.error.code).toBe('email_taken');
    expect(await ctx.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });
});

describe('sign-in and sign-out', () => {
  it('signs in with the right password and refuses a wrong one', async () => {
    const { email } = await signUp(ctx.app);
    const agent = request.agent(ctx.app);
    const wrong = await agent.post('/api/auth/sign-in').send({ email, password: 'not the password' }).expect(401);
    expect(wrong.body.error.code).toBe('wrong_credentials');
    await agent.get('/api/me').expect(401);
    const ok = await agent.post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(200);
    expect(ok.body.user.email).toBe(email);
    await agent.get('/api/me').expect(200);
  });

  it('gives the same answer for an unknown address as for a wrong password', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-in').send({ email: uniqueEmail('nobody'), password: 'whatever it is' }).expect(401);
    expect(res.body.error.message).toBe('That e-mail and password do not match an account.');
  });

  it('ends the session on sign-out: the old cookie no longer works', async () => {
    const { agent } = await signUp(ctx.app);
    const me = await agent.get('/api/me').expect(200);
    const cookie = me.request.getHeader?.('cookie');
    await agent.post('/api/auth/sign-out').expect(204);
    await agent.get('/api/me').expect(401);
    if (typeof cookie === 'string') await request(ctx.app).get('/api/me').set('Cookie', cookie).expect(401);
  });

  it('expires sessions: a session past its expiry answers 401 and clears the cookie', async () => {
    const { agent, me } = await signUp(ctx.app);
    await ctx.database.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.userId, me.user.id));
    const res = await agent.get('/api/me').expect(401);
    expect(String(res.headers['set-cookie'])).toMatch(/tidefield_session=;/);
  });

  it('renews a session used in the second half of its life (lucia fresh session)', async () => {
    const { agent, me } = await signUp(ctx.app);
    const soon = new Date(Date.now() + 60 * 60 * 1000); // 1 h left of 30 days
    await ctx.database.db.update(sessions).set({ expiresAt: soon }).where(eq(sessions.userId, me.user.id));
    const res = await agent.get('/api/me').expect(200);
    expect(String(res.headers['set-cookie'])).toMatch(/tidefield_session=\w+/);
    const [row] = await ctx.database.db.select().from(sessions).where(eq(sessions.userId, me.user.id));
    expect(row!.expiresAt.getTime()).toBeGreaterThan(Date.now() + 29 * 24 * 3600 * 1000);
  });

  it('rate-limits failed sign-ins with a clear 429 message and Retry-After', async () => {
    const { email } = await signUp(ctx.app);
    for (let i = 0; i < 3; i++) await request(ctx.app).post('/api/auth/sign-in').send({ email, password: 'wrong password!' }).expect(401);
    const res = await request(ctx.app).post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(429);
    expect(res.body.error.code).toBe('rate_limited');
    expect(res.body.error.message).toMatch(/Try again in 10 minutes/);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    // Another address from the same client is not locked out.
    const other = await signUp(ctx.app);
    await request(ctx.app).post('/api/auth/sign-in').send({ email: other.email, password: GOOD_PASSWORD }).expect(200);
  });
});

describe('origin check', () => {
  it('refuses a state-changing request from another origin with 403', async () => {
    const { agent } = await signUp(ctx.app);
    const res = await agent.post('/api/auth/sign-out').set('Origin', 'https://evil.example').expect(403);
    expect(res.body.error.code).toBe('bad_origin');
    await agent.get('/api/me').expect(200);
  });

  it('accepts the same origin and requests without an Origin (non-browser clients)', async () => {
    const { agent } = await signUp(ctx.app);
    const me = await agent.get('/api/me').expect(200);
    // supertest starts a server on a new port per request, so pin the Host header.
    await agent
      .post('/api/me/department')
      .set('Host', 'localhost:3000')
      .set('Origin', 'http://localhost:3000')
      .send({ departmentId: me.body.department.id })
      .expect(200);
    await agent.post('/api/me/department').send({ departmentId: me.body.department.id }).expect(200);
  });

  it('refuses a cross-site fetch even without Origin (Sec-Fetch-Site)', async () => {
    const { agent } = await signUp(ctx.app);
    await agent.post('/api/auth/sign-out').set('Sec-Fetch-Site', 'cross-site').expect(403);
  });
});

describe('security fixes (issue 9)', () => {
  it('https PUBLIC_URL makes the session cookie Secure without a proxy header', async () => {
    const httpsCtx = await createTestApp({ PUBLIC_URL: 'https://tidefield.example' });
    try {
      const res = await confirmSignUp(httpsCtx, (r) => r);
      expect(String(res.headers['set-cookie'])).toMatch(/;\s*Secure/i);
    } finally {
      await httpsCtx.close();
    }
  });

  it('password spraying: failed sign-ins over many e-mails from one client address are limited', async () => {
    const sprayCtx = await createTestApp({ SIGN_IN_LIMIT: 100, SIGN_IN_CLIENT_LIMIT: 4 });
    try {
      for (let i = 0; i < 4; i += 1) {
        await request(sprayCtx.app).post('/api/auth/sign-in').send({ email: uniqueEmail('spray'), password: 'Summer2026!!' }).expect(401);
      }
      const refused = await request(sprayCtx.app).post('/api/auth/sign-in').send({ email: uniqueEmail('spray'), password: 'Summer2026!!' }).expect(429);
      expect(refused.body.error.code).toBe('rate_limited');
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await sprayCtx.close();
    }
  });

  it('sign-up is rate-limited per e-mail address and per client address', async () => {
    const limited = await createTestApp({ SIGN_UP_LIMIT: 5 });
    try {
      const email = uniqueEmail('again');
      const body = { email, password: GOOD_PASSWORD, name: 'R', department: 'D' };
      await request(limited.app).post('/api/auth/sign-up').send(body).expect(202);
      await request(limited.app).post('/api/auth/sign-up').send(body).expect(202);
      await request(limited.app).post('/api/auth/sign-up').send(body).expect(202);
      const perAddress = await request(limited.app).post('/api/auth/sign-up').send(body).expect(429);
      expect(perAddress.body.error.message).toMatch(/this e-mail address/);
      await request(limited.app).post('/api/auth/sign-up').send({ ...body, email: uniqueEmail() }).expect(202);
      const perClient = await request(limited.app).post('/api/auth/sign-up').send({ ...body, email: uniqueEmail() }).expect(429);
      expect(perClient.body.error.message).toMatch(/from your network/);
    } finally {
      await limited.close();
    }
  });
});
