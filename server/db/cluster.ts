/**
 * Project-local PostgreSQL from Debian's packages: used by `npm start`, `npm run dev` and the test suites.
 *
 * PostgreSQL refuses to run as root, so as root every server program runs as the unprivileged `postgres`
 * OS user through `runuser -u postgres --` (the user is created when missing); as any other user the
 * programs run directly. The server listens on 127.0.0.1 only, with its Unix socket in a folder of its own.
 */
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, chmodSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { ensureSystemPackages, pgBinDir } from '../lib/system-packages';

export const databaseName = 'stillspan';

/** The repository root (two levels above this file). */
export const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export class ClusterError extends Error {
  override name = 'ClusterError';
}

function log(message: string): void {
  process.stdout.write(`[postgres] ${message}\n`);
}

/** Runs a command to completion; rejects with its output when it fails. */
function run(command: string, args: string[]): Promise<string> {
  return new Promise((resolvePromise, reject) => {
    const child = spawn(command, args, { cwd: '/', stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code) => {
      if (code === 0) resolvePromise(output);
      else reject(new ClusterError(`${[command, ...args].join(' ')} exited with ${code}:\n${output.trim()}`));
    });
  });
}

/** Runs one of PostgreSQL's programs, as the `postgres` user when we are root. */
function runPg(program: string, args: string[]): Promise<string> {
  const binary = join(pgBinDir, program);
  return isRoot ? run('runuser', ['-u', 'postgres', '--', binary, ...args]) : run(binary, args);
}

/**
 * Makes sure Debian's PostgreSQL 15 programs are there, the same way `npm test` checks its packages: as root installs
 * them with apt, otherwise stops with the exact command to run.
 */
function ensurePostgresInstalled(): void {
  const problem = ensureSystemPackages(['postgresql']);
  if (problem) throw new ClusterError(problem);
}

/** As root: creates the `postgres` OS user when it is missing. */
async function ensurePostgresUser(): Promise<void> {
  if (!isRoot) return;
  if (spawnSync('id', ['postgres'], { stdio: 'ignore' }).status === 0) return;
  log('creating the postgres OS user');
  await run('useradd', ['--system', '--user-group', '--no-create-home', '--home-dir', '/nonexistent', '--shell', '/usr/sbin/nologin', 'postgres']);
}

/** True when the `postgres` OS user can enter `dir` (every parent must be searchable). Always true as non-root. */
export function postgresCanEnter(dir: string): boolean {
  if (!isRoot) return true;
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir], { cwd: '/', stdio: 'ignore' }).status === 0;
}

/** Creates `dir` owned by the server's user with mode 0700 (PostgreSQL insists on it for its data folder). */
async function makePrivateDir(dir: string): Promise<void> {
  mkdirSync(dir, { recursive: true });
  chmodSync(dir, 0o700);
  if (isRoot) await run('chown', ['postgres:postgres', dir]);
}

export interface ClusterPaths {
  dataDir: string;
  socketDir: string;
  logFile: string;
}

/**
 * Where the project's own cluster lives: `.data/pg` in the repository when the `postgres` user can enter the
 * repository, else a folder under the system's temporary folder named after the repository.
 */
export function projectClusterPaths(root = repoRoot): ClusterPaths & { inRepository: boolean } {
  const tag = createHash('sha256').update(root).digest('hex').slice(0, 10);
  const inRepository = postgresCanEnter(root);
  const base = inRepository ? join(root, '.data') : join(tmpdir(), `stillspan-${tag}`);
  return {
    inRepository,
    dataDir: join(base, 'pg'),
    // Unix socket paths are limited to about 100 characters: keep the socket folder short.
    socketDir: join(tmpdir(), `stillspan-pg-${tag}`),
    logFile: join(base, 'pg', 'server.log'),
  };
}

function clusterInitialised(dataDir: string): boolean {
  return existsSync(join(dataDir, 'PG_VERSION'));
}

async function initCluster(dataDir: string): Promise<void> {
  await makePrivateDir(dataDir);
  await runPg('initdb', ['-N', '-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
}

/** True when a server runs on this data folder (pg_ctl status exits 0). */
async function clusterRunning(dataDir: string): Promise<boolean> {
  if (!existsSync(join(dataDir, 'postmaster.pid'))) return false;
  return runPg('pg_ctl', ['-D', dataDir, 'status']).then(
    () => true,
    () => false,
  );
}

/** The port a running server on this data folder listens on (line 4 of postmaster.pid). */
function runningPort(dataDir: string): number | null {
  try {
    const lines = readFileSync(join(dataDir, 'postmaster.pid'), 'utf8').split('\n');
    const port = Number(lines[3]);
    return Number.isInteger(port) && port > 0 ? port : null;
  } catch {
    return null;
  }
}

async function startServer(paths: ClusterPaths, port: number, extraSettings: string[]): Promise<void> {
  await makePrivateDir(paths.socketDir);
  const settings = ['-c listen_addresses=127.0.0.1', `-p ${port}`, `-k ${paths.socketDir}`, ...extraSettings].join(' ');
  try {
    await runPg('pg_ctl', ['-D', paths.dataDir, '-l', paths.logFile, '-w', '-t', '30', '-o', settings, 'start']);
  } catch (error) {
    let tail = '';
    try {
      tail = readFileSync(paths.logFile, 'utf8').trim().split('\n').slice(-8).join('\n');
    } catch {
      /* no log yet */
    }
    throw new ClusterError(`PostgreSQL did not start on 127.0.0.1:${port} (is the port taken? set STILLSPAN_PG_PORT).\n${tail || (error as Error).message}`);
  }
}

async function stopServer(dataDir: string): Promise<void> {
  await runPg('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', '-t', '30', 'stop']);
}

export function clusterUrl(port: number, database = databaseName): string {
  return `postgres://postgres@127.0.0.1:${port}/${database}`;
}

/** Creates `name` on the cluster when it does not exist yet. */
export async function ensureDatabase(port: number, name = databaseName, template?: string): Promise<void> {
  const client = new pg.Client({ connectionString: clusterUrl(port, 'postgres') });
  await client.connect();
  try {
    const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount === 0) {
      const quoted = `"${name.replace(/"/g, '""')}"`;
      await client.query(`CREATE DATABASE ${quoted}${template ? ` TEMPLATE "${template.replace(/"/g, '""')}"` : ''}`);
    }
  } finally {
    await client.end();
  }
}

export interface RunningCluster {
  url: string;
  port: number;
  dataDir: string;
  /** True when this process started the server (and so stops it); false when it found one running. */
  startedHere: boolean;
  stop(): Promise<void>;
}

/**
 * The project's own cluster for `npm start` and `npm run dev`: initdb the first time, start it unless it already
 * runs, create the `stillspan` database. Data is kept between starts.
 */
export async function startProjectCluster(port: number, root = repoRoot): Promise<RunningCluster> {
  ensurePostgresInstalled();
  await ensurePostgresUser();
  const paths = projectClusterPaths(root);
  if (!paths.inRepository) {
    log(`the postgres user cannot enter ${root}; keeping the database in ${paths.dataDir} instead`);
  }
  if (isRoot) {
    mkdirSync(dirname(paths.dataDir), { recursive: true, mode: 0o755 });
  }
  if (!clusterInitialised(paths.dataDir)) {
    log(`creating a new cluster in ${paths.dataDir}`);
    await initCluster(paths.dataDir);
  }
  let startedHere = false;
  let actualPort = port;
  if (await clusterRunning(paths.dataDir)) {
    actualPort = runningPort(paths.dataDir) ?? port;
    log(`already running on 127.0.0.1:${actualPort} (${paths.dataDir}); it will be left running`);
    if (actualPort !== port) log(`note: STILLSPAN_PG_PORT is ${port} but the running server uses ${actualPort}`);
  } else {
    await startServer(paths, port, []);
    startedHere = true;
    log(`started on 127.0.0.1:${port} (data in ${paths.dataDir})`);
  }
  await ensureDatabase(actualPort);
  let stopped = false;
  return {
    url: clusterUrl(actualPort),
    port: actualPort,
    dataDir: paths.dataDir,
    startedHere,
    async stop() {
      if (!startedHere || stopped) return;
      stopped = true;
      // A Ctrl-C in the terminal may have reached the server already.
      if (!(await clusterRunning(paths.dataDir))) {
        log('already stopped');
        return;
      }
      await stopServer(paths.dataDir);
      log('stopped');
    },
  };
}

/** A port that was free a moment ago on 127.0.0.1. */
export function findFreePort(): Promise<number> {
  return new Promise((resolvePromise, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolvePromise(port));
    });
  });
}

/**
 * A fresh cluster for a test run: initdb in a new temporary folder, a free port, fsync off. `stop()` stops the server
 * and deletes the folder.
 */
export async function startThrowawayCluster(): Promise<{ url: string; port: number; stop(): Promise<void>; pause(): Promise<void>; resume(): Promise<void> }> {
  ensurePostgresInstalled();
  await ensurePostgresUser();
  const base = mkdtempSync(join(tmpdir(), 'stillspan-test-pg-'));
  chmodSync(base, 0o755);
  const paths: ClusterPaths = { dataDir: join(base, 'data'), socketDir: join(base, 'sock'), logFile: join(base, 'server.log') };
  if (isRoot) {
    // The log file sits beside the data folder: let the postgres user write it.
    await run('chown', ['postgres:postgres', base]);
  }
  await initCluster(paths.dataDir);
  let port: number;
  for (let attempt = 0; ; attempt += 1) {
    port = await findFreePort();
    try {
      await startServer(paths, port, ['-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off']);
      break;
    } catch (error) {
      if (attempt >= 2) {
        rmSync(base, { recursive: true, force: true });
        throw error;
      }
    }
  }
  await ensureDatabase(port);
  let stopped = false;
  let paused = false;
  const settings = ['-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off'];
  return {
    url: clusterUrl(port),
    port,
    /** Stops the server but keeps its data (an outage); `resume()` starts it again on the same port. */
    async pause() {
      await stopServer(paths.dataDir);
      paused = true;
    },
    async resume() {
      await startServer(paths, port, settings);
      paused = false;
    },
    async stop() {
      if (stopped) return;
      stopped = true;
      try {
        if (!paused) await stopServer(paths.dataDir);
      } finally {
        rmSync(base, { recursive: true, force: true });
      }
    },
  };
}
