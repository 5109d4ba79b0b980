/**
 * The pool of worker threads that runs the numerical engine off the server's event loop (piscina), so that no
 * single computation holds up other requests. Each task gets a time limit from the moment a worker starts it: a task
 * still running when it passes is ended by terminating its worker (piscina starts a new one) and answered 503
 * `compute_timeout`. A full queue, or a wait for a free worker beyond its own limit, is 503 `compute_busy`. Every module that runs engine work goes through it: compute commands
 * through `runCommand`, tuning variants and site records (their CSV parsed here too) through `runJob`. The workers
 * load the engine from a prebuilt bundle (engine-bundle.mjs). The pool holds no state a second server process would
 * need.
 */
import { availableParallelism } from 'node:os';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { HttpError } from '../lib/http-error';
import type { EngineJob, EngineTask, EngineTaskResult } from './engine-task';

export interface EnginePoolOptions {
  /** Worker threads; default: the number of cores. */
  threads?: number;
  /** Time limit of one task from the moment it starts to run in a worker, in milliseconds. */
  taskTimeoutMs: number;
  /**
   * Longest wait for a free worker (other tasks, or a new worker loading the engine after one was stopped) before the
   * task is given up with 503 compute_busy; default the time limit plus 30 s.
   */
  queueTimeoutMs?: number;
  /** Largest answer in bytes of JSON. */
  maxAnswerBytes: number;
  /** Tasks waiting for a thread before new ones are refused (503 compute_busy). */
  maxQueue?: number;
  /**
   * Where the workers load the engine from: 'bundle' (default), the prebuilt minified bundle of engine-task
   * (engine-bundle.mjs, rebuilt first when a source is newer), or 'sources', the TypeScript through tsx.
   */
  engineCode?: 'bundle' | 'sources';
  /** Folder of the bundle's builds; default .cache/engine in the repository. */
  engineCacheDir?: string;
}

export interface EnginePool {
  /**
   * Runs a compute command (validated by its own schema in the worker) and resolves with its answer as a JSON
   * string. Throws HttpError: 400 invalid request, 404 unknown command, 422 answer_too_large, 503 compute_timeout
   * or compute_busy.
   */
  runCommand(command: string, request: unknown): Promise<string>;
  /** The same, with the answer parsed. */
  runCommandValue<T = unknown>(command: string, request: unknown): Promise<T>;
  /**
   * Runs engine work of the server's own modules (a tuning variant's result, size or curves) with the same time
   * limit and answer bound; the engine's refusal of the input is HttpError 400 invalid_request with its issues.
   */
  runJob<T = unknown>(job: EngineJob): Promise<T>;
  /** Where a worker loaded the engine from: "bundle build-…" or "sources". */
  engineOrigin(): Promise<string>;
  readonly threads: number;
  close(): Promise<void>;
}

const workerFile = new URL('./engine-worker.mjs', import.meta.url).href;

export function createEnginePool(options: EnginePoolOptions): EnginePool {
  const threads = Math.max(1, options.threads ?? availableParallelism());
  const piscina = new Piscina({
    filename: workerFile,
    minThreads: threads,
    maxThreads: threads,
    maxQueue: options.maxQueue ?? threads * 64,
    // Workers stay up: starting one costs the loading of the engine.
    idleTimeout: Number.MAX_SAFE_INTEGER,
    workerData: { engineCode: options.engineCode ?? 'bundle', engineCacheDir: options.engineCacheDir },
  });
  // A worker that fails to start must not crash the server; the task that needed it reports the error.
  piscina.on('error', (error: unknown) => {
    process.stderr.write(`[engine] worker error: ${error instanceof Error ? error.message : String(error)}\n`);
  });

  async function runTask(fields: Pick<EngineTask, 'command' | 'request' | 'job' | 'probe'>): Promise<string> {
    const { port1, port2 } = new MessageChannel();
    const task: EngineTask = { ...fields, maxAnswerBytes: options.maxAnswerBytes, startedPort: port2 };
    const controller = new AbortController();
    let outcome = 'running' as 'running' | 'timeout' | 'queue';
    let runTimer: NodeJS.Timeout | undefined;
    // Waiting for a worker has its own limit; the task's time limit starts when the worker begins to run it.
    const queueTimer = setTimeout(() => {
      outcome = 'queue';
      controller.abort();
    }, options.queueTimeoutMs ?? options.taskTimeoutMs + 30_000);
    port1.once('message', () => {
      clearTimeout(queueTimer);
      runTimer = setTimeout(() => {
        outcome = 'timeout';
        controller.abort();
      }, options.taskTimeoutMs);
    });
    let result: EngineTaskResult;
    try {
      result = (await piscina.run(task, { signal: controller.signal, transferList: [port2] })) as EngineTaskResult;
    } catch (error) {
      if (outcome === 'timeout') {
        throw new HttpError(
          503,
          'compute_timeout',
          `The computation took longer than ${Number((options.taskTimeoutMs / 1000).toPrecision(3))} s and was stopped: ask for fewer points, factors or dampers`,
        );
      }
      if (outcome === 'running' && error instanceof Error && error.name === 'AbortError') {
        // The pool is closing (the server shuts down) with this task still queued or running.
        throw new HttpError(503, 'shutting_down', 'The server is shutting down: try again in a moment');
      }
      if (outcome === 'queue' || (error instanceof Error && /queue is at limit/i.test(error.message))) {
        throw new HttpError(503, 'compute_busy', 'The server is busy with other computations: try again in a moment');
      }
      throw error;
    } finally {
      clearTimeout(queueTimer);
      clearTimeout(runTimer);
      port1.close();
    }
    if (!result.ok) throw new HttpError(result.status, result.code, result.message, result.issues);
    return result.json;
  }

  const runCommand = (command: string, request: unknown) => runTask({ command, request });

  return {
    threads,
    runCommand,
    async runJob<T>(job: EngineJob) {
      return JSON.parse(await runTask({ command: job.kind, request: null, job })) as T;
    },
    async engineOrigin() {
      return JSON.parse(await runTask({ command: '', request: null, probe: 'origin' })) as string;
    },
    async runCommandValue<T>(command: string, request: unknown) {
      return JSON.parse(await runCommand(command, request)) as T;
    },
    async close() {
      await piscina.close({ force: true });
    },
  };
}
