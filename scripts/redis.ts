/**
 * A private Redis server for Tidefield's scale-out mode (BullMQ): Debian's `redis-server`,
 * installed with apt-get when missing (as root), started on 127.0.0.1 on its own port with its
 * own folder, pid file and log, and never touching another Redis on the machine (no system
 * service, no /etc/redis config).
 *
 *   tsx scripts/redis.ts start   # idempotent; prints REDIS_URL for the app and the workers
 *   tsx scripts/redis.ts stop
 *   tsx scripts/redis.ts status
 *
 * The test setup calls ensureRedis() with a temporary folder and no persistence.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync, readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_STATE_DIR, portIsFree, readPid, stopProcess } from './mariadb.ts';

export interface RedisOptions {
  /** Folder for the pid file, the log and (when persisting) the append-only file. */
  stateDir: string;
  port: number;
  /** Keep queued jobs across restarts of Redis (append-only file); tests run without. */
  persist?: boolean;
  log?: (line: string) => void;
}

const SEARCH_PATHS = ['/usr/bin', '/usr/sbin', '/usr/local/bin', '/usr/local/sbin', '/bin', '/sbin'];

function findRedisServer(): string | undefined {
  for (const dir of [...(process.env.PATH ?? '').split(':').filter(Boolean), ...SEARCH_PATHS]) {
    const candidate = path.join(dir, 'redis-server');
    if (existsSync(candidate)) return candidate;
  }
  return undefined;
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** Installs Debian's redis-server when it is missing (as root), else says how. */
export function ensureRedisInstalled(log: (line: string) => void = console.log): string {
  const found = findRedisServer();
  if (found) return found;
  const command = 'apt-get update && apt-get install -y redis-server';
  if (!isRoot()) throw new Error(`Redis is not installed (redis-server not found). Install it with:\n  sudo apt-get update && sudo apt-get install -y redis-server`);
  log(`redis-server not found: installing Debian's redis-server (${command}) …`);
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', '--no-install-recommends', 'redis-server']]) {
    const res = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (res.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed (exit ${res.status}); run as root: ${command}`);
  }
  const installed = findRedisServer();
  if (!installed) throw new Error('redis-server was installed but is still not found');
  return installed;
}

function paths(stateDir: string) {
  return { pidFile: path.join(stateDir, 'redis.pid'), logFile: path.join(stateDir, 'redis.log'), dataDir: path.join(stateDir, 'redis') };
}

/** Answers PING over a plain socket (no client library needed). */
function ping(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    let text = '';
    socket.setTimeout(1000);
    socket.on('connect', () => socket.write('PING\r\n'));
    socket.on('data', (data) => {
      text += data.toString();
      if (text.includes('\r\n')) {
        socket.destroy();
        resolve(text.startsWith('+PONG'));
      }
    });
    socket.on('error', () => resolve(false));
    socket.on('timeout', () => {
      socket.destroy();
      resolve(false);
    });
  });
}

/** Starts (or reuses) the private Redis of this folder and returns its REDIS_URL. */
export async function ensureRedis(options: RedisOptions): Promise<string> {
  const log = options.log ?? console.log;
  const p = paths(options.stateDir);
  mkdirSync(p.dataDir, { recursive: true });
  const url = `redis://127.0.0.1:${options.port}`;
  if (!readPid(p.pidFile)) {
    const redisServer = ensureRedisInstalled(log);
    if (!(await portIsFree(options.port))) {
      throw new Error(`Port ${options.port} on 127.0.0.1 is taken by another program, so Tidefield's private Redis cannot use it. Choose another with REDIS_PORT=<port>.`);
    }
    log(`Starting private Redis on 127.0.0.1:${options.port} …`);
    const out = openSync(p.logFile, 'a');
    const child = spawn(
      redisServer,
      [
        '--port', String(options.port),
        '--bind', '127.0.0.1',
        '--protected-mode', 'yes',
        '--dir', p.dataDir,
        '--pidfile', p.pidFile,
        '--daemonize', 'no',
        '--save', '',
        '--appendonly', options.persist ? 'yes' : 'no',
        // BullMQ needs its keys kept: never evict.
        '--maxmemory-policy', 'noeviction',
      ],
      { detached: true, stdio: ['ignore', out, out] },
    );
    child.unref();
  }
  const deadline = Date.now() + 20_000;
  while (!(await ping(options.port))) {
    if (Date.now() > deadline) {
      const tail = existsSync(p.logFile) ? readFileSync(p.logFile, 'utf8').split('\n').slice(-15).join('\n') : '(no log)';
      throw new Error(`Redis did not answer on 127.0.0.1:${options.port} within 20 s. Last lines of ${p.logFile}:\n${tail}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  return url;
}

/** Stops the private Redis of this folder (SIGTERM, then waits for it to exit). */
export async function stopRedis(stateDir: string, log: (line: string) => void = console.log): Promise<boolean> {
  const pid = readPid(paths(stateDir).pidFile);
  if (!pid) return false;
  await stopProcess(pid, 'private Redis', log);
  return true;
}

/** Port of the development Redis: REDIS_PORT or 6479. */
export function devRedisPort(): number {
  const raw = process.env.REDIS_PORT ?? '6479';
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`REDIS_PORT must be a port number 1–65535 (got ${raw})`);
  return port;
}

async function main(command: string | undefined) {
  const stateDir = DEFAULT_STATE_DIR;
  switch (command) {
    case 'start': {
      const url = await ensureRedis({ stateDir, port: devRedisPort(), persist: true });
      console.log(`Redis ready: REDIS_URL=${url}`);
      break;
    }
    case 'stop':
      if (!(await stopRedis(stateDir))) console.log('Private Redis is not running.');
      break;
    case 'status': {
      const pid = readPid(paths(stateDir).pidFile);
      console.log(pid ? `Private Redis is running (pid ${pid}).` : 'Private Redis is not running.');
      break;
    }
    default:
      console.error('usage: tsx scripts/redis.ts start|stop|status');
      process.exitCode = 2;
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main(process.argv[2]).catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
