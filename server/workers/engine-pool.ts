/**
 * The pool of worker threads that runs the numerical engine off the server's event loop (piscina), so that no
 * single computation holds up other requests. Each task gets a time limit: a task still running when it passes is
 * ended by terminating its worker (piscina starts a new one) and answered 503 `compute_timeout`. A full queue is
 * 503 `compute_busy`. Every module that runs engine work (compute commands, and later variants, sizing, site
 * records) goes through `runCommand`. The pool holds no state a second server process would need.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { HttpError } from '../lib/http-error';
import type { EngineTask, EngineTaskResult } from './engine-task';

export interface EnginePoolOptions {
  /** Worker threads; default: the number of cores. */
  threads?: number;
  /** Time limit of one task from the moment it is queued, in milliseconds. */
  taskTimeoutMs: number;
  /** Largest answer in bytes of JSON. */
  maxAnswerBytes: number;
  /** Tasks waiting for a thread before new ones are refused (503 compute_busy). */
  maxQueue?: number;
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
  });
  // A worker that fails to start must not crash the server; the task that needed it reports the error.
  piscina.on('error', (error: unknown) => {
    process.stderr.write(`[engine] worker error: ${error instanceof Error ? error.message : String(error)}\n`);
  });

  async function runCommand(command: string, request: unknown): Promise<string> {
    const task: EngineTask = { command, request, maxAnswerBytes: options.maxAnswerBytes };
    let result: EngineTaskResult;
    const signal = AbortSignal.timeout(options.taskTimeoutMs);
    try {
      result = (await piscina.run(task, { signal })) as EngineTaskResult;
    } catch (error) {
      if (signal.aborted) {
        throw new HttpError(
          503,
          'compute_timeout',
          `The computation took longer than ${Math.round(options.taskTimeoutMs / 1000)} s and was stopped: ask for fewer points, factors or dampers`,
        );
      }
      if (error instanceof Error && /queue is at limit/i.test(error.message)) {
        throw new HttpError(503, 'compute_busy', 'The server is busy with other computations: try again in a moment');
      }
      throw error;
    }
    if (!result.ok) throw new HttpError(result.status, result.code, result.message, result.issues);
    return result.json;
  }

  return {
    threads,
    runCommand,
    async runCommandValue<T>(command: string, request: unknown) {
      return JSON.parse(await runCommand(command, request)) as T;
    },
    async close() {
      await piscina.close({ force: true });
    },
  };
}
