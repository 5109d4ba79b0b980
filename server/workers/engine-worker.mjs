// Entry of the engine's worker threads (piscina). Node.js 20 cannot load TypeScript by itself: when the process
// already runs with a TypeScript loader (`node --import tsx`, inherited by worker threads) the task module is
// imported directly; otherwise (vitest's workers, a process started without it) tsx's scoped import loads it.
// See docs/decisions/0014-engine-worker-pool.md.
import { URL } from 'node:url';

const taskModule = new URL('./engine-task.ts', import.meta.url).href;

async function load() {
  try {
    return await import(taskModule);
  } catch (error) {
    if (error?.code !== 'ERR_UNKNOWN_FILE_EXTENSION') throw error;
    const { tsImport } = await import('tsx/esm/api');
    return tsImport(taskModule, import.meta.url);
  }
}

const loaded = load();

export default async function runEngineTask(task) {
  const { runEngineTask: run } = await loaded;
  // The time limit counts from here: the pool waits for this message before it starts the clock.
  task.startedPort?.postMessage('started');
  task.startedPort?.close();
  return run(task);
}
