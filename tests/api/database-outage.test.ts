/**
 * What callers get while the database is down (issue 9, items 3 and 4): this file runs its own
 * MariaDB, stops it under a running app, and starts it again.
 */
import { Writable } from 'node:stream';
import type { ChunkExecutor } from '../../server/engine-pool/chunk-executor.ts';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type TidefieldApp } from '../../server/app.ts';
import { connectDatabase, migrateDatabase, type Database } from '../../server/db/client.ts';
import { createLogger } from '../../server/logger.ts';
import { newId } from '../../server/db/columns.ts';
import { insertUser } from '../../server/modules/auth/auth.repository.ts';
import { hashPassword } from '../../server/modules/auth/password.ts';
import { SESSION_COOKIE } from '../../server/modules/auth/session.ts';
import { startPrivateMariaDb, type PrivateMariaDb } from '../support/private-mariadb.ts';
import { GOOD_PASSWORD, uniqueEmail } from '../support/test-app.ts';

let mariadb: PrivateMariaDb;
let database: Database;
let tidefield: TidefieldApp;
const logLines: string[] = [];

beforeAll(async () => {
  mariadb = await startPrivateMariaDb();
  database = connectDatabase(mariadb.config);
  await migrateDatabase(database);
  const config = { ...mariadb.config, LOG_LEVEL: 'info' as const };
  const sink = new Writable({
    write(chunk: Buffer, _encoding, done) {
      logLines.push(chunk.toString('utf8'));
      done();
    },
  });
  // Runs never start here, so no worker pool: the executor refuses.
  const executor: ChunkExecutor = {
    kind: 'embedded',
    // eslint-disable-next-line require-yield
    async *execute() {
      throw new Error('no runs in this test');
    },
    close: async () => {},
  };
  tidefield = createApp({ config, database, logger: createLogger(config, sink), executor });
}, 180_000);

afterAll(async () => {
  await tidefield?.close();
  await database?.close();
  await mariadb?.remove();
}, 120_000);

async function untilHealthy(timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await request(tidefield.app).get('/api/health');
    if (res.status === 200 || Date.now() > deadline) return res;
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe('database outage', () => {
  it('health answers 503 for every caller and 503 with Retry-After and a cause code elsewhere; the session id never reaches the log', async () => {
    const agent = request.agent(tidefield.app);
    const email = uniqueEmail('outage');
    // No mail server here: the account is made in the database, and signing in opens the session.
    await insertUser(database.db, { id: newId(), email, name: 'Outage', passwordHash: await hashPassword(GOOD_PASSWORD), createdAt: new Date() });
    const opened = await agent.post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(200);
    const sessionId = new RegExp(`${SESSION_COOKIE}=([^;]+)`).exec(String(opened.headers['set-cookie']))![1]!;
    expect(sessionId.length).toBeGreaterThan(10);
    await agent.get('/api/me').expect(200);
    expect((await request(tidefield.app).get('/api/health').expect(200)).body.database.reachable).toBe(true);

    await mariadb.stop();

    for (const caller of [request(tidefield.app), agent]) {
      const health = await caller.get('/api/health').expect(503);
      expect(health.headers['content-type']).toMatch(/application\/json/);
      expect(health.body).toMatchObject({ status: 'degraded', database: { reachable: false } });
      // No error text or internals in the public answer.
      expect(Object.keys(health.body.database)).toEqual(['reachable']);
      expect(JSON.stringify(health.body)).not.toMatch(/ECONN|connect|127\.0\.0\.1|sql/i);
    }
    const me = await agent.get('/api/me').expect(503);
    expect(me.body.error.code).toBe('database_unavailable');
    expect(me.headers['retry-after']).toBe('5');
    const signIn = await request(tidefield.app).post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD }).expect(503);
    expect(signIn.body.error.code).toBe('database_unavailable');
    expect(signIn.headers['retry-after']).toBe('5');

    const log = logLines.join('');
    expect(log).toMatch(/database unreachable/);
    // The failed query was logged, with its bound values (the session id among them) left out.
    expect(log).toMatch(/params: \[redacted\]/);
    expect(log).not.toContain(sessionId);

    await mariadb.start();
    expect((await untilHealthy(20_000)).status).toBe(200);
    await agent.get('/api/me').expect(200);
    expect(logLines.join('')).not.toContain(sessionId);
  }, 180_000);
});
