// Entry of the engine's worker threads (piscina). The task module `engine-task.ts` runs from a prebuilt, minified
// bundle with V8's code cache (engine-bundle.mjs; built or rebuilt first when a source is newer), so a worker starts
// without transpiling the engine. Only when the bundle cannot be had (esbuild absent from a production install, a build
// error), or when the pool asks for the sources, is the TypeScript loaded as such: imported directly when the process
// already runs with a TypeScript loader (`node --import tsx`, inherited by worker threads), otherwise through tsx's
// scoped import. See docs/decisions/0014-engine-worker-pool.md.
import process from 'node:process';
import { URL } from 'node:url';
import { workerData } from 'piscina';
import { ensureEngineBundle, loadEngineBundle, defaultCacheDir } from './engine-bundle.mjs';

const taskModule = new URL('./engine-task.ts', import.meta.url).href;
const options = workerData ?? {};

async function loadSources() {
  try {
    return await import(taskModule);
  } catch (error) {
    if (error?.code !== 'ERR_UNKNOWN_FILE_EXTENSION') throw error;
    const { tsImport } = await import('tsx/esm/api');
    return tsImport(taskModule, import.meta.url);
  }
}

/** The task module and, for the bundle, the function that writes its code cache after the first task. */
async function load() {
  if (options.engineCode === 'sources') return { exports: await loadSources(), origin: 'sources', writeCodeCache() {} };
  const cacheDir = options.engineCacheDir ?? defaultCacheDir;
  let bundle;
  try {
    bundle = loadEngineBundle(await ensureEngineBundle(cacheDir), cacheDir);
  } catch (error) {
    process.stderr.write(`[engine] no prebuilt engine bundle (${error instanceof Error ? error.message : String(error)}); loading the TypeScript sources\n`);
    return { exports: await loadSources(), origin: 'sources', writeCodeCache() {} };
  }
  return { exports: bundle.exports, origin: `bundle ${bundle.build}`, writeCodeCache: bundle.writeCodeCache };
}

const loaded = load();

export default async function runEngineTask(task) {
  const { exports, origin, writeCodeCache } = await loaded;
  // The time limit counts from here: the pool waits for this message before it starts the clock.
  task.startedPort?.postMessage('started');
  task.startedPort?.close();
  if (task.probe === 'origin') return { ok: true, json: JSON.stringify(origin) };
  try {
    return exports.runEngineTask(task);
  } finally {
    writeCodeCache();
  }
}
