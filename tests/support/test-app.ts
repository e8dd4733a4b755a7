import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import mysql from 'mysql2/promise';
import request from 'supertest';
import { inject } from 'vitest';
import type { Express } from 'express';
import { createApp, type AppDeps, type TidefieldApp } from '../../server/app.ts';
import { ensurePublishedLibrary } from '../../server/modules/samples/samples.service.ts';
import { testConfig, type Config } from '../../server/config.ts';
import { connectDatabase, migrateDatabase, type Database } from '../../server/db/client.ts';
import { createLogger } from '../../server/logger.ts';
import { startFakesOnFreePorts, type FakesOnFreePorts } from '../../server/fakes/local-fakes.ts';
import type { DbConnection } from '../../scripts/mariadb.ts';
import { linkToken } from './billing.ts';

export interface TestContext {
  app: Express;
  tidefield: TidefieldApp;
  database: Database;
  config: Config;
  /** The payment and mail stand-ins this app is pointed at (shared by the test file's apps). */
  fakes: FakesOnFreePorts;
  /** Where the app listens for real (the payment stand-in posts its webhooks here). */
  url: string;
  close(): Promise<void>;
}

// The stand-ins are started once per test file, on free ports, and stopped with its last app.
let fakes: Promise<FakesOnFreePorts> | null = null;
let fakeUsers = 0;
export const TEST_STRIPE_SECRETS = { apiKey: 'sk_test_tidefield_tests', webhookSecret: 'whsec_tidefield_tests' };

async function acquireFakes(): Promise<FakesOnFreePorts> {
  fakeUsers += 1;
  fakes ??= startFakesOnFreePorts(TEST_STRIPE_SECRETS);
  return fakes;
}

async function releaseFakes(): Promise<void> {
  fakeUsers -= 1;
  if (fakeUsers > 0 || !fakes) return;
  const running = fakes;
  fakes = null;
  await (await running).close();
}

/** A fresh, migrated database on the throwaway server and an app wired to it. */
export async function createTestDatabase(conn: DbConnection = inject('testDb')): Promise<{ database: Database; config: Config; drop(): Promise<void> }> {
  const name = `tf_${randomBytes(6).toString('hex')}`;
  const admin = await mysql.createConnection({ host: conn.host, port: conn.port, user: conn.user, password: conn.password });
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.end();
  const config = testConfig({ DB_HOST: conn.host, DB_PORT: conn.port, DB_USER: conn.user, DB_PASSWORD: conn.password, DB_NAME: name });
  const database = connectDatabase(config);
  await migrateDatabase(database);
  return {
    database,
    config,
    async drop() {
      await database.close();
      const a = await mysql.createConnection({ host: conn.host, port: conn.port, user: conn.user, password: conn.password });
      await a.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await a.end();
    },
  };
}

export async function createTestApp(
  overrides: Partial<Config> = {},
  deps: Partial<Omit<AppDeps, 'config' | 'database' | 'logger'>> = {},
  /** A MariaDB server of the test file's own (default: the suite's shared throwaway server). */
  dbServer: DbConnection = inject('testDb'),
): Promise<TestContext> {
  const { database, config: base, drop } = await createTestDatabase(dbServer);
  const stands = await acquireFakes();
  // The app also listens on a real port: webhooks and e-mailed links need an address.
  const server = http.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  const url = `http://127.0.0.1:${port}`;
  const config = { ...base, WORKER_THREADS: 2, CHECKPOINT_INTERVAL_MS: 50, PORT: port, PUBLIC_URL: url, ...stands.config, ...overrides };
  await ensurePublishedLibrary(database.db);
  const tidefield = createApp({ config, database, logger: createLogger(config), ...deps });
  server.on('request', tidefield.app);
  stands.payment.setWebhookUrl(`${url}/api/billing/webhook`);
  await tidefield.scheduler.start();
  return {
    app: tidefield.app,
    tidefield,
    database,
    config,
    fakes: stands,
    url,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await tidefield.close();
      await releaseFakes();
      await drop();
    },
  };
}

/** A second app (as after a restart) on the same database as ctx. The caller closes it. */
export async function restartApp(ctx: TestContext, deps: Partial<Omit<AppDeps, 'config' | 'database' | 'logger'>> = {}): Promise<TidefieldApp> {
  const tidefield = createApp({ config: ctx.config, database: ctx.database, logger: createLogger(ctx.config), ...deps });
  await tidefield.scheduler.start();
  return tidefield;
}

let counter = 0;
/** A unique e-mail for this test run. */
export function uniqueEmail(label = 'user'): string {
  counter += 1;
  return `${label}-${counter}-${randomBytes(3).toString('hex')}@test.example`;
}

export const GOOD_PASSWORD = 'correct horse battery';

/**
 * Signs up a new user (with a new department) the way a person does: asks for the account,
 * reads the confirmation link from the test file's mail stand-in, opens it, and returns the
 * cookie-carrying agent. The app must send its mail to that stand-in (createTestApp does).
 */
export async function signUp(app: Express, options: { email?: string; name?: string; department?: string } = {}) {
  if (!fakes) throw new Error('signUp needs the mail stand-in of createTestApp');
  const mail = (await fakes).mail;
  const agent = request.agent(app);
  const email = options.email ?? uniqueEmail();
  const asked = await agent
    .post('/api/auth/sign-up')
    .send({ email, password: GOOD_PASSWORD, name: options.name ?? 'Test Person', department: options.department ?? `Dept ${email}` });
  if (asked.status !== 202) throw new Error(`sign-up failed: ${asked.status} ${JSON.stringify(asked.body)}`);
  const message = await mail.waitFor((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
  const res = await agent.post('/api/auth/sign-up/confirm').send({ token: linkToken(message, '/confirm-sign-up') });
  if (res.status !== 201) throw new Error(`sign-up confirmation failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, email, me: res.body as { user: { id: string }; department: { id: string; name: string } } };
}
export const SIGN_UP_SUBJECT = 'Confirm your Tidefield account';

/** A new admin of a new department, made in the database directly (for an app whose mail goes nowhere a test can read). */
export async function signUpWithoutMail(ctx: TestContext) {
  const { insertDepartment } = await import('../../server/modules/departments/departments.repository.ts');
  const { newId } = await import('../../server/db/columns.ts');
  const departmentId = newId();
  await insertDepartment(ctx.database.db, { id: departmentId, name: `Dept ${departmentId}`, createdAt: new Date() });
  return { departmentId, ...(await addMember(ctx, departmentId, 'admin')) };
}

/** Adds a new user to a department with a role (the way an accepted invitation would) and signs them in. */
export async function addMember(ctx: TestContext, departmentId: string, role: 'admin' | 'modeller' | 'observer') {
  const { hashPassword } = await import('../../server/modules/auth/password.ts');
  const { insertUser } = await import('../../server/modules/auth/auth.repository.ts');
  const { insertMembership } = await import('../../server/modules/departments/departments.repository.ts');
  const { newId } = await import('../../server/db/columns.ts');
  const id = newId();
  const email = uniqueEmail(role);
  await insertUser(ctx.database.db, { id, email, name: `A ${role}`, passwordHash: await hashPassword(GOOD_PASSWORD), createdAt: new Date() });
  await insertMembership(ctx.database.db, { userId: id, departmentId, role, createdAt: new Date() });
  const agent = request.agent(ctx.app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password: GOOD_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, email, userId: id };
}
