/**
 * `npm run loadtest`: requests per second and latency percentiles of the real server under load, measured with
 * autocannon on loopback. Starts its own throwaway PostgreSQL and the server (`node --import tsx server/index.ts`,
 * test mode, so the invented demo organisation is seeded), signs in as the demo engineer, and loads
 *   GET /api/health, GET /api/projects (signed in), POST /api/compute/assess (signed in)
 * at 10 and 50 connections for LOADTEST_DURATION_S seconds each (default 10). A variant read is loaded when that
 * route exists; until then it is skipped with a note. Figures, not a test: nothing here fails on a slow machine.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { repoRoot } from '../../server/db/cluster';
import { demoPassword } from '../../server/db/seed';
import { findFreePort, startThrowawayCluster } from '../support/pg-cluster';

const durationS = Number(process.env.LOADTEST_DURATION_S ?? 10);
const connectionCounts = [10, 50];

/** Invented demo values (a 40 t footbridge mode at 2 Hz with one damper under a Sétra crowd). */
const assessBody = {
  structure: { modalMassKg: 40_000, frequencyHz: 2.0, dampingRatio: 0.005, direction: 'vertical' },
  tmds: [{ massKg: 800, frequencyHz: 1.96, dampingRatio: 0.08 }],
  loadCase: { kind: 'crowd', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 150 },
  criteria: { set: 'en1990', class: 'normal-use' },
};

async function waitForHealth(baseUrl: string, server: ChildProcess): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the server stopped (exit ${server.exitCode})`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((wait) => setTimeout(wait, 250));
  }
  throw new Error('the server did not become healthy within 60 s');
}

function cookiesOf(response: Response): string[] {
  return response.headers.getSetCookie().map((cookie) => cookie.split(';')[0]);
}

/** Signs in through Auth.js (csrf → credentials) and returns the Cookie header of the session. */
async function signIn(baseUrl: string, email: string): Promise<string> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = cookiesOf(csrf);
  const response = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded', Cookie: jar.join('; ') },
    body: new URLSearchParams({ csrfToken, email, password: demoPassword }).toString(),
  });
  const session = cookiesOf(response).find((cookie) => cookie.startsWith('authjs.session-token='));
  if (!session) throw new Error(`sign-in as ${email} failed (${response.status} ${response.headers.get('location')})`);
  return session;
}

interface Row {
  name: string;
  connections: number;
  requestsPerS: number;
  p50Ms: number;
  p97_5Ms: number;
  p99Ms: number;
  non2xx: number;
  errors: number;
}

async function load(name: string, url: string, connections: number, options: Partial<autocannon.Options> = {}): Promise<Row> {
  const result = await autocannon({ url, connections, duration: durationS, ...options });
  if (name === 'warm-up') process.stdout.write('.');
  return {
    name,
    connections,
    requestsPerS: Math.round(result.requests.average),
    p50Ms: result.latency.p50,
    p97_5Ms: result.latency.p97_5,
    p99Ms: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
  };
}

async function main(): Promise<void> {
  const cluster = await startThrowawayCluster();
  const clientDir = mkdtempSync(join(tmpdir(), 'stillspan-load-client-'));
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>Stillspan</title>');
  const port = await findFreePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: cluster.url,
      AUTH_SECRET: randomBytes(32).toString('hex'),
      APP_URL: baseUrl,
      SMTP_PORT: '0',
      STILLSPAN_CLIENT_DIR: clientDir,
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  try {
    await waitForHealth(baseUrl, server);
    const cookie = await signIn(baseUrl, 'engineer@demo.stillspan.test');
    const headers = { cookie, 'content-type': 'application/json' };
    // Warm-up, not recorded: every engine worker loads the engine on its first task, and the pool's connections open.
    await load('warm-up', `${baseUrl}/api/projects`, 10, { headers, duration: 2 });
    await load('warm-up', `${baseUrl}/api/compute/assess`, 10, { method: 'POST', headers, body: JSON.stringify(assessBody), duration: 3 });
    const rows: Row[] = [];
    for (const connections of connectionCounts) {
      rows.push(await load('GET /api/health', `${baseUrl}/api/health`, connections));
      rows.push(await load('GET /api/projects (signed in)', `${baseUrl}/api/projects`, connections, { headers }));
      rows.push(await load('POST /api/compute/assess', `${baseUrl}/api/compute/assess`, connections, { method: 'POST', headers, body: JSON.stringify(assessBody) }));
    }
    const variantProbe = await fetch(`${baseUrl}/api/projects/00000000-0000-4000-8000-000000000000/variants`, { headers: { cookie } });
    const variantNote = variantProbe.status === 404 && ((await variantProbe.json()) as { error?: { code?: string } }).error?.code === 'not_found'
      ? 'variant read: skipped, the route GET /api/projects/:id/variants does not exist yet'
      : 'variant read: the route exists; add a project with a variant to this load test to measure it';

    const load1 = (await import('node:os')).loadavg()[0];
    process.stdout.write(`\nStillspan load test: ${durationS} s per row, loopback, autocannon; ${(await import('node:os')).availableParallelism()} cores, load average ${load1.toFixed(1)} at the end\n\n`);
    process.stdout.write('| route | connections | req/s | p50 ms | p97.5 ms | p99 ms | non-2xx | errors |\n| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |\n');
    for (const row of rows) {
      process.stdout.write(`| ${row.name} | ${row.connections} | ${row.requestsPerS} | ${row.p50Ms} | ${row.p97_5Ms} | ${row.p99Ms} | ${row.non2xx} | ${row.errors} |\n`);
    }
    process.stdout.write(`\n${variantNote}\n`);
  } finally {
    await new Promise<void>((done) => {
      if (server.exitCode !== null) return done();
      server.once('exit', () => done());
      server.kill('SIGTERM');
      setTimeout(() => server.kill('SIGKILL'), 10_000).unref();
    });
    await cluster.stop();
    rmSync(clientDir, { recursive: true, force: true });
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`loadtest failed: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
