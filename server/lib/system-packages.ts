/** Debian packages the project runs on: installed with apt when we are root, otherwise the exact command is given. */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

/** Where Debian's postgresql package (version 15) puts the server programs. */
export const pgBinDir = '/usr/lib/postgresql/15/bin';

export const systemPackages = {
  postgresql: {
    present: () => existsSync(join(pgBinDir, 'initdb')) && existsSync(join(pgBinDir, 'pg_ctl')),
    what: `PostgreSQL 15 (${pgBinDir})`,
  },
  chromium: { present: () => existsSync('/usr/bin/chromium'), what: 'Chromium (/usr/bin/chromium), for the end-to-end tests' },
} as const;

export type SystemPackage = keyof typeof systemPackages;

/** Installs the missing packages as root; returns a message to print and stop with when it cannot. */
export function ensureSystemPackages(names: SystemPackage[]): string | null {
  const missing = names.filter((name) => !systemPackages[name].present());
  if (missing.length === 0) return null;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot) {
    return [
      `Missing: ${missing.map((name) => systemPackages[name].what).join('; ')}.`,
      'Install with:',
      `  sudo apt-get update && sudo apt-get install -y ${missing.join(' ')}`,
    ].join('\n');
  }
  process.stdout.write(`[setup] installing ${missing.join(' ')} with apt-get\n`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const update = spawnSync('apt-get', ['update'], { stdio: 'inherit', env });
  const install = update.status === 0 ? spawnSync('apt-get', ['install', '-y', ...missing], { stdio: 'inherit', env }) : update;
  if (install.status !== 0) return `apt-get could not install ${missing.join(' ')}; run: apt-get update && apt-get install -y ${missing.join(' ')}`;
  const still = missing.filter((name) => !systemPackages[name].present());
  return still.length > 0 ? `apt-get ran but ${still.join(', ')} is still missing` : null;
}
