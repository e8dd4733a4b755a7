/**
 * A private MariaDB server for Tidefield: installed from Debian's packages when missing,
 * initialised in its own data directory, bound to 127.0.0.1 on its own port and socket, and
 * never touching any other MariaDB/MySQL on the machine (`--no-defaults` skips /etc/mysql).
 *
 *   tsx scripts/mariadb.ts start   # idempotent; prints the connection (without the password)
 *   tsx scripts/mariadb.ts stop
 *   tsx scripts/mariadb.ts status
 *
 * `npm start` and the test setup call ensureMariaDb() directly.
 */
import { spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import mysql from 'mysql2/promise';

export interface MariaDbOptions {
  /** Folder that holds `mariadb/` (data), the socket, pid and log files and the credentials. */
  stateDir: string;
  port: number;
  database: string;
  appUser: string;
  /** Grant the application user every privilege on the server (throwaway test servers only). */
  grantAll?: boolean;
  log?: (line: string) => void;
}

export interface DbConnection {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

export const PROJECT_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const DEFAULT_STATE_DIR = path.join(PROJECT_ROOT, '.data');

const SEARCH_PATHS = ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin', '/sbin', '/bin'];

function findBinary(name: string): string | undefined {
  for (const dir of [...(process.env.PATH ?? '').split(':').filter(Boolean), ...SEARCH_PATHS]) {
    const candidate = path.join(dir, name);
    if (existsSync(candidate)) return candidate;
  }
  return undefined;
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** Installs Debian's mariadb-server when mariadbd is missing (as root), else explains how. */
export function ensureMariaDbInstalled(log: (line: string) => void = console.log): { mariadbd: string; installDb: string } {
  let mariadbd = findBinary('mariadbd');
  let installDb = findBinary('mariadb-install-db');
  if (mariadbd && installDb) return { mariadbd, installDb };
  const command = 'apt-get update && apt-get install -y mariadb-server';
  if (!isRoot()) {
    throw new Error(`MariaDB is not installed (mariadbd not found). Install it with:\n  sudo ${command.replace('&& apt-get', '&& sudo apt-get')}`);
  }
  log(`mariadbd not found: installing Debian's mariadb-server (${command}) …`);
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'mariadb-server']]) {
    const res = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (res.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed (exit ${res.status}); run as root: ${command}`);
  }
  mariadbd = findBinary('mariadbd');
  installDb = findBinary('mariadb-install-db');
  if (!mariadbd || !installDb) throw new Error('mariadb-server was installed but mariadbd is still missing');
  return { mariadbd, installDb };
}

function paths(stateDir: string) {
  return {
    dataDir: path.join(stateDir, 'mariadb'),
    // Unix sockets have a ~108-byte path limit; keep the socket in the state dir only when short.
    socket: shortSocketPath(stateDir),
    pidFile: path.join(stateDir, 'mariadb.pid'),
    logFile: path.join(stateDir, 'mariadb.log'),
    credentials: path.join(stateDir, 'db-credentials.json'),
  };
}

function shortSocketPath(stateDir: string): string {
  const preferred = path.join(stateDir, 'mariadb.sock');
  if (preferred.length < 100) return preferred;
  const tag = Buffer.from(stateDir).toString('base64url').slice(-16);
  return path.join(os.tmpdir(), `tidefield-${tag}.sock`);
}

/** The pid in a pid file, if that process is alive. */
export function readPid(pidFile: string): number | undefined {
  if (!existsSync(pidFile)) return undefined;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  if (!Number.isInteger(pid) || pid <= 0) return undefined;
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return undefined;
  }
}

async function adminConnect(socket: string) {
  // unix_socket authentication: the OS user that runs this script is a MariaDB superuser of
  // the private instance, and nobody can reach it as such over TCP.
  return mysql.createConnection({ socketPath: socket, user: os.userInfo().username, multipleStatements: false });
}

async function waitUntilReady(socket: string, timeoutMs: number, logFile: string): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let lastError: unknown;
  while (Date.now() < deadline) {
    try {
      const conn = await adminConnect(socket);
      await conn.query('SELECT 1');
      await conn.end();
      return;
    } catch (error) {
      lastError = error;
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '(no log)';
  throw new Error(`MariaDB did not answer within ${timeoutMs / 1000} s (${String(lastError)}). Last lines of ${logFile}:\n${tail}`);
}

export function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

export function findFreePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

function loadOrCreatePassword(credentialsFile: string, user: string): string {
  if (existsSync(credentialsFile)) {
    const saved = JSON.parse(readFileSync(credentialsFile, 'utf8')) as { user: string; password: string };
    if (saved.user === user && saved.password) return saved.password;
  }
  const password = randomBytes(18).toString('base64url');
  writeFileSync(credentialsFile, JSON.stringify({ user, password }, null, 2) + '\n', { mode: 0o600 });
  return password;
}

/** Starts (or reuses) the private server and makes sure the database and app user exist. */
export async function ensureMariaDb(options: MariaDbOptions): Promise<DbConnection> {
  const log = options.log ?? console.log;
  const p = paths(options.stateDir);
  mkdirSync(options.stateDir, { recursive: true });

  if (!readPid(p.pidFile)) {
    const { mariadbd, installDb } = ensureMariaDbInstalled(log);
    if (!existsSync(path.join(p.dataDir, 'mysql'))) {
      log(`Initialising a private MariaDB data directory in ${p.dataDir} …`);
      mkdirSync(p.dataDir, { recursive: true });
      const res = spawnSync(
        installDb,
        [
          '--no-defaults',
          `--datadir=${p.dataDir}`,
          '--auth-root-authentication-method=socket',
          '--skip-test-db',
          ...(isRoot() ? ['--user=root'] : []),
        ],
        { encoding: 'utf8' },
      );
      if (res.status !== 0) {
        rmSync(p.dataDir, { recursive: true, force: true });
        throw new Error(`mariadb-install-db failed (exit ${res.status}):\n${res.stderr || res.stdout}`);
      }
    }
    if (!(await portIsFree(options.port))) {
      throw new Error(
        `Port ${options.port} on 127.0.0.1 is taken by another program, so Tidefield's private MariaDB cannot use it. ` +
          `Choose another port with DB_PORT=<port>.`,
      );
    }
    log(`Starting private MariaDB on 127.0.0.1:${options.port} …`);
    const out = openSync(p.logFile, 'a');
    const child = spawn(
      mariadbd,
      [
        '--no-defaults',
        ...(isRoot() ? ['--user=root'] : []),
        `--datadir=${p.dataDir}`,
        `--port=${options.port}`,
        `--socket=${p.socket}`,
        `--pid-file=${p.pidFile}`,
        '--bind-address=127.0.0.1',
        '--skip-name-resolve',
        '--innodb-buffer-pool-size=128M',
        '--max-connections=200',
        '--character-set-server=utf8mb4',
        '--collation-server=utf8mb4_unicode_ci',
      ],
      { detached: true, stdio: ['ignore', out, out] },
    );
    child.unref();
  }
  await waitUntilReady(p.socket, 30_000, p.logFile);

  const password = loadOrCreatePassword(p.credentials, options.appUser);
  const admin = await adminConnect(p.socket);
  try {
    const db = options.database.replace(/[^A-Za-z0-9_]/g, '');
    await admin.query(`CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await admin.query('CREATE USER IF NOT EXISTS ?@? IDENTIFIED BY ?', [options.appUser, '127.0.0.1', password]);
    // Keep the password in step with the credentials file if an older one was set.
    await admin.query('ALTER USER ?@? IDENTIFIED BY ?', [options.appUser, '127.0.0.1', password]);
    if (options.grantAll) {
      await admin.query('GRANT ALL PRIVILEGES ON *.* TO ?@?', [options.appUser, '127.0.0.1']);
    } else {
      await admin.query(`GRANT ALL PRIVILEGES ON \`${db}\`.* TO ?@?`, [options.appUser, '127.0.0.1']);
    }
  } finally {
    await admin.end();
  }
  return { host: '127.0.0.1', port: options.port, user: options.appUser, password, database: options.database };
}

/** Ends a server process: SIGTERM, up to 30 s to exit, then SIGKILL. */
export async function stopProcess(pid: number, name: string, log: (line: string) => void): Promise<void> {
  process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    try {
      process.kill(pid, 0);
      await new Promise((r) => setTimeout(r, 100));
    } catch {
      log(`Stopped ${name} (pid ${pid}).`);
      return;
    }
  }
  process.kill(pid, 'SIGKILL');
}

/** Stops the private server of this state folder (SIGTERM, then waits for it to exit). */
export async function stopMariaDb(stateDir: string, log: (line: string) => void = console.log): Promise<boolean> {
  const pid = readPid(paths(stateDir).pidFile);
  if (!pid) return false;
  await stopProcess(pid, 'private MariaDB', log);
  return true;
}

export function mariaDbStatus(stateDir: string): { running: boolean; pid?: number } {
  const pid = readPid(paths(stateDir).pidFile);
  return pid ? { running: true, pid } : { running: false };
}

/** Port of the development server: DB_PORT or 3407. */
export function devDbPort(): number {
  const raw = process.env.DB_PORT ?? '3407';
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`DB_PORT must be a port number 1–65535 (got ${raw})`);
  return port;
}

/**
 * Starts (or reuses) the development database of .data/ and returns it as the server's DB_*
 * settings, ready to spread into loadConfig's input.
 */
export async function ensureDevDatabase(): Promise<{ conn: DbConnection; env: Record<string, string> }> {
  const conn = await ensureMariaDb({ stateDir: DEFAULT_STATE_DIR, port: devDbPort(), database: 'tidefield', appUser: 'tidefield' });
  return {
    conn,
    env: { DB_HOST: conn.host, DB_PORT: String(conn.port), DB_USER: conn.user, DB_PASSWORD: conn.password, DB_NAME: conn.database },
  };
}

async function main(command: string | undefined) {
  const stateDir = DEFAULT_STATE_DIR;
  switch (command) {
    case 'start': {
      const { conn } = await ensureDevDatabase();
      console.log(`MariaDB ready: mysql://${conn.user}@${conn.host}:${conn.port}/${conn.database} (password in .data/db-credentials.json)`);
      break;
    }
    case 'stop':
      if (!(await stopMariaDb(stateDir))) console.log('Private MariaDB is not running.');
      break;
    case 'status': {
      const s = mariaDbStatus(stateDir);
      console.log(s.running ? `Private MariaDB is running (pid ${s.pid}).` : 'Private MariaDB is not running.');
      break;
    }
    default:
      console.error('usage: tsx scripts/mariadb.ts start|stop|status');
      process.exitCode = 2;
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main(process.argv[2]).catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
