import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessions } from '../../server/modules/auth/sessions.table.ts';
import { users } from '../../server/modules/users/users.table.ts';
import { GOOD_PASSWORD, createTestApp, signUp, uniqueEmail, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp({ SIGN_IN_LIMIT: 3, SIGN_IN_WINDOW_MINUTES: 10 });
});
afterAll(() => ctx.close());

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
    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password: GOOD_PASSWORD, name: 'B', department: 'D' })
      .expect(201);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/tidefield_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('marks the cookie Secure behind https (trusted proxy)', async () => {
    const secureCtx = await createTestApp({ TRUST_PROXY: true });
    try {
      const res = await request(secureCtx.app)
        .post('/api/auth/sign-up')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: uniqueEmail(), password: GOOD_PASSWORD, name: 'C', department: 'D' })
        .expect(201);
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

  it('refuses a second account for the same e-mail with 409 on the email field', async () => {
    const { email } = await signUp(ctx.app);
    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: email.toUpperCase(), password: GOOD_PASSWORD, name: 'A', department: 'D' })
      .expect(409);
    expect(res.body.error.field).toBe('email');
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
      const res = await request(httpsCtx.app)
        .post('/api/auth/sign-up')
        .send({ email: uniqueEmail(), password: GOOD_PASSWORD, name: 'S', department: 'D' })
        .expect(201);
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
      await request(limited.app).post('/api/auth/sign-up').send(body).expect(201);
      await request(limited.app).post('/api/auth/sign-up').send(body).expect(409);
      await request(limited.app).post('/api/auth/sign-up').send(body).expect(409);
      const perAddress = await request(limited.app).post('/api/auth/sign-up').send(body).expect(429);
      expect(perAddress.body.error.message).toMatch(/this e-mail address/);
      await request(limited.app).post('/api/auth/sign-up').send({ ...body, email: uniqueEmail() }).expect(201);
      const perClient = await request(limited.app).post('/api/auth/sign-up').send({ ...body, email: uniqueEmail() }).expect(429);
      expect(perClient.body.error.message).toMatch(/from your network/);
    } finally {
      await limited.close();
    }
  });
});
