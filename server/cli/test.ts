/**
 * `npm test`: makes sure Debian's PostgreSQL and Chromium are there (installs them as root, else names the apt
 * command), then runs every Vitest project (unit, integration, e2e); each suite starts the services it needs.
 * Extra arguments go to vitest (`npm test -- --project integration`). The engine workers' bundle is built first, once,
 * so that the suites' many worker pools find it ready instead of racing to build it.
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { repoRoot } from '../db/cluster';
import { ensureSystemPackages } from '../lib/system-packages';
import { ensureEngineBundle } from '../workers/engine-bundle.mjs';

const problem = ensureSystemPackages(['postgresql', 'chromium']);
if (problem) {
  process.stderr.write(`${problem}\n`);
  process.exit(1);
}

try {
  await ensureEngineBundle();
} catch (error) {
  // The workers fall back to the sources (and say so); the tests still run.
  process.stderr.write(`[engine] could not build the engine bundle before the tests: ${error instanceof Error ? error.message : String(error)}\n`);
}

const child = spawn(process.execPath, [join(repoRoot, 'node_modules', 'vitest', 'vitest.mjs'), 'run', ...process.argv.slice(2)], {
  cwd: repoRoot,
  stdio: 'inherit',
  env: { ...process.env, NODE_ENV: 'test' },
});
const forward = (signal: NodeJS.Signals) => child.kill(signal);
process.on('SIGINT', forward);
process.on('SIGTERM', forward);
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
