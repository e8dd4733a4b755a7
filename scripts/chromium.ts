/**
 * Debian's Chromium for the browser tests: found where Debian installs it, installed with
 * apt-get when missing and we are root (never a browser download), or a clear instruction.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const CANDIDATES = ['/usr/bin/chromium', '/usr/lib/chromium/chromium', '/usr/bin/chromium-browser'];

export function findChromium(): string | undefined {
  return CANDIDATES.find((p) => existsSync(p));
}

export function ensureChromium(log: (line: string) => void = console.log): string {
  const found = findChromium();
  if (found) return found;
  const command = 'apt-get update && apt-get install -y chromium';
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    throw new Error(`Chromium is needed for the browser tests. Install Debian's package with:\n  sudo ${command.replace('&& apt-get', '&& sudo apt-get')}`);
  }
  log(`Chromium not found: installing Debian's chromium (${command}) …`);
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'chromium']]) {
    const res = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (res.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed (exit ${res.status}); run as root: ${command}`);
  }
  const installed = findChromium();
  if (!installed) throw new Error('chromium was installed but no binary was found');
  return installed;
}

/** The flags this machine needs: headless, no sandbox as root, and no calls to the closed network. */
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];
