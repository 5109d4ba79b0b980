/**
 * `npm run dev`: the project's PostgreSQL, the API restarted on every change (tsx watch) on PORT, and the Vite dev
 * server on 5173 that proxies /api to it. Ctrl-C stops all three (PostgreSQL only if this command started it).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { repoRoot, type RunningCluster } from '../db/cluster';
import { appUrlGiven, EnvError, getEnv } from '../env';
import { startProjectDatabaseUnlessGiven, stopOnSignals } from './project-database';

const viteUrl = 'http://localhost:5173';
const children: ChildProcess[] = [];
let cluster: RunningCluster | null = null;
let stopping = false;

function waitForExit(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolvePromise) => child.once('exit', () => resolvePromise()));
}

async function stopAll(code: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    for (const child of children) child.kill('SIGTERM');
    await Promise.all(children.map(waitForExit));
    await cluster?.stop().catch((error: unknown) => process.stderr.write(`[postgres] could not stop: ${String(error)}\n`));
  }
  process.exit(code);
}

function run(name: string, args: string[], env: NodeJS.ProcessEnv): void {
  const child = spawn(process.execPath, args, { cwd: repoRoot, stdio: 'inherit', env });
  child.on('exit', (exitCode, signal) => {
    if (stopping) return;
    process.stderr.write(`[dev] ${name} stopped (${signal ?? `exit code ${exitCode}`}); stopping the rest\n`);
    void stopAll(exitCode ?? 1);
  });
  children.push(child);
}

async function main(): Promise<void> {
  stopOnSignals(stopAll);
  const env = getEnv();
  cluster = await startProjectDatabaseUnlessGiven(env.pgPort);
  if (stopping) return;
  const childEnv: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'development',
    PORT: String(env.port),
    DATABASE_URL: cluster?.url ?? env.databaseUrl,
    // Links in mails go to the Vite dev server, where the client is.
    APP_URL: appUrlGiven() ? env.appUrl : viteUrl,
  };
  run('API', [join(repoRoot, 'node_modules', 'tsx', 'dist', 'cli.mjs'), 'watch', '--clear-screen=false', 'server/index.ts'], childEnv);
  run('Vite', [join(repoRoot, 'node_modules', 'vite', 'bin', 'vite.js')], childEnv);
  process.stdout.write(`[dev] open ${viteUrl} (API on http://localhost:${env.port})\n`);
}

main().catch(async (error: unknown) => {
  process.stderr.write(error instanceof EnvError ? `${error.message}\n` : `[dev] could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  await stopAll(1);
});
