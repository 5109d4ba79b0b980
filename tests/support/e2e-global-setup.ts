/**
 * Global set-up of the end-to-end suite: builds the client, starts a throwaway PostgreSQL cluster and the real
 * server on a free port (the server migrates and seeds the invented demo organisation at start outside
 * production), waits until it reports healthy, and hands its base URL to the tests (`inject('baseUrl')`).
 * The teardown stops the server and removes the cluster.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type {} from 'vitest';
import type { TestProject } from 'vitest/node';
import { repoRoot } from '../../server/db/cluster';
import { findFreePort, startThrowawayCluster } from './pg-cluster';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    resultsDir: string;
  }
}

const resultsDir = join(repoRoot, 'test-results', 'e2e');
const healthTimeoutMs = 60_000;

/**
 * Builds the client as it ships (vitest runs with NODE_ENV=test, which would otherwise give React's development
 * build) into a folder of this run's own, so that a `npm start` or another build in the same checkout is untouched.
 */
function buildClient(outDir: string): void {
  const result = spawnSync('npx', ['vite', 'build', '--outDir', outDir, '--emptyOutDir'], {
    cwd: repoRoot,
    encoding: 'utf8',
    env: { ...process.env, NODE_ENV: 'production' },
  });
  if (result.status !== 0) {
    throw new Error(`vite build failed (exit ${result.status}):\n${result.stdout}\n${result.stderr}`);
  }
}

async function waitForHealth(baseUrl: string, server: ChildProcess, log: () => string): Promise<void> {
  const deadline = Date.now() + healthTimeoutMs;
  let last = 'no answer yet';
  while (Date.now() < deadline) {
    if (server.exitCode !== null || server.signalCode !== null) {
      throw new Error(`The server stopped before it became healthy (exit ${server.exitCode ?? server.signalCode}):\n${log()}`);
    }
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) return;
      last = `${response.status} ${await response.text()}`;
    } catch (error) {
      last = (error as Error).message;
    }
    await new Promise((wait) => setTimeout(wait, 250));
  }
  throw new Error(`GET /api/health did not answer 200 within ${healthTimeoutMs / 1000} s (last: ${last}):\n${log()}`);
}

function stopServer(server: ChildProcess): Promise<void> {
  if (server.exitCode !== null || server.signalCode !== null) return Promise.resolve();
  return new Promise((done) => {
    const force = setTimeout(() => server.kill('SIGKILL'), 10_000);
    server.once('exit', () => {
      clearTimeout(force);
      done();
    });
    server.kill('SIGTERM');
  });
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  mkdirSync(resultsDir, { recursive: true });
  const clientDir = mkdtempSync(join(tmpdir(), 'stillspan-e2e-client-'));
  buildClient(clientDir);

  const cluster = await startThrowawayCluster();
  let server: ChildProcess | undefined;
  let output = '';
  try {
    const port = await findFreePort();
    const baseUrl = `http://127.0.0.1:${port}`;
    server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: repoRoot,
      env: {
        ...process.env,
        NODE_ENV: 'test',
        DATABASE_URL: cluster.url,
        PORT: String(port),
        AUTH_SECRET: randomBytes(32).toString('hex'),
        APP_URL: baseUrl,
        STILLSPAN_CLIENT_DIR: clientDir,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    server.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    server.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    await waitForHealth(baseUrl, server, () => output);

    project.provide('baseUrl', baseUrl);
    project.provide('resultsDir', resultsDir);
  } catch (error) {
    if (server) await stopServer(server);
    await cluster.stop();
    rmSync(clientDir, { recursive: true, force: true });
    throw error;
  }

  const running = server;
  return async () => {
    await stopServer(running);
    writeFileSync(join(resultsDir, 'server.log'), output);
    await cluster.stop();
    rmSync(clientDir, { recursive: true, force: true });
  };
}
