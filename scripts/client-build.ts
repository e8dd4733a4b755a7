import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from './mariadb.ts';

const CLIENT_INPUTS = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/** Builds the client with Vite unless dist/client is newer than every client input. */
export function buildClientIfStale(log: (line: string) => void = console.log, force = false): void {
  const builtIndex = path.join(PROJECT_ROOT, 'dist/client/index.html');
  const built = existsSync(builtIndex) ? statSync(builtIndex).mtimeMs : 0;
  const inputs = Math.max(...CLIENT_INPUTS.map((p) => newestMtime(path.join(PROJECT_ROOT, p))));
  if (!force && built > inputs) {
    log('Client build is up to date (dist/client).');
    return;
  }
  log('Building the client with Vite …');
  const vite = path.join(PROJECT_ROOT, 'node_modules/vite/bin/vite.js');
  const res = spawnSync(process.execPath, [vite, 'build', '--logLevel', 'warn'], { cwd: PROJECT_ROOT, stdio: 'inherit' });
  if (res.status !== 0) throw new Error(`vite build failed (exit ${res.status})`);
}
