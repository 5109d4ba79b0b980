/**
 * `npm start`: the project's own PostgreSQL (created the first time, data kept between starts), the client build,
 * migrations, the demo seed on an empty database, and the server on PORT. Ctrl-C or SIGTERM stops the server and
 * the PostgreSQL this command started.
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { repoRoot, type RunningCluster } from '../db/cluster';
import { EnvError, getEnv } from '../env';
import { startServer, type RunningServer } from '../server';
import { startProjectDatabaseUnlessGiven, stopOnSignals } from './project-database';
import { ensureEngineBundle } from '../workers/engine-bundle.mjs';

let cluster: RunningCluster | null = null;
let server: RunningServer | null = null;
let stopping = false;

async function stopAll(code: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    await server?.close().catch((error: unknown) => process.stderr.write(`[stillspan] ${String(error)}\n`));
    await cluster?.stop().catch((error: unknown) => process.stderr.write(`[postgres] could not stop: ${String(error)}\n`));
  }
  process.exit(code);
}

/** The engine workers' bundle, so that the first computation does not wait for it (the workers fall back to the sources). */
async function buildEngineBundle(): Promise<void> {
  try {
    await ensureEngineBundle();
  } catch (error) {
    process.stderr.write(`[engine] could not build the engine bundle: ${error instanceof Error ? error.message : String(error)}\n`);
  }
}

function buildClient(): Promise<void> {
  return new Promise((resolvePromise, reject) => {
    process.stdout.write('[stillspan] building the client (vite build)\n');
    const child = spawn(process.execPath, [join(repoRoot, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'], {
      cwd: repoRoot,
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: 'production' },
    });
    child.on('error', reject);
    child.on('exit', (code, signal) => (code === 0 ? resolvePromise() : reject(new Error(`vite build failed (${signal ?? `exit code ${code}`})`))));
  });
}

async function main(): Promise<void> {
  stopOnSignals(stopAll);
  const env = getEnv();
  cluster = await startProjectDatabaseUnlessGiven(env.pgPort);
  if (stopping) return;
  await buildClient();
  if (stopping) return;
  await buildEngineBundle();
  if (stopping) return;
  server = await startServer({ ...env, databaseUrl: cluster?.url ?? env.databaseUrl });
  process.stdout.write(`[stillspan] open ${env.appUrl} — Ctrl-C stops the server${cluster?.startedHere ? ' and its PostgreSQL' : ''}\n`);
}

main().catch(async (error: unknown) => {
  process.stderr.write(error instanceof EnvError ? `${error.message}\n` : `[stillspan] could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  await stopAll(1);
});
