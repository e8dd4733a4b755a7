/**
 * Debian's astropy (python3-astropy, read by the export tests as the independent astronomy
 * table reader) and xmllint (libxml2-utils, the XML schema check): found, installed with
 * apt-get when missing and we are root, or a clear instruction.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export const SYSTEM_PYTHON = '/usr/bin/python3';
const PACKAGES = ['python3-astropy', 'libxml2-utils'];

function present(): boolean {
  if (!existsSync(SYSTEM_PYTHON) || !existsSync('/usr/bin/xmllint')) return false;
  return spawnSync(SYSTEM_PYTHON, ['-c', 'import astropy.table, astropy.io.votable'], { stdio: 'ignore' }).status === 0;
}

export function ensureAstropy(log: (line: string) => void = console.log): void {
  if (present()) return;
  const command = `apt-get update && apt-get install -y ${PACKAGES.join(' ')}`;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    throw new Error(`astropy and xmllint are needed for the export tests. Install Debian's packages with:\n  sudo ${command.replace('&& apt-get', '&& sudo apt-get')}`);
  }
  log(`astropy or xmllint not found: installing Debian's ${PACKAGES.join(', ')} (${command}) …`);
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', ...PACKAGES]]) {
    const res = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (res.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed (exit ${res.status}); run as root: ${command}`);
  }
  if (!present()) throw new Error('python3-astropy was installed but /usr/bin/python3 cannot import astropy');
}
