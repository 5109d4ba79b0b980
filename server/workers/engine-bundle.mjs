// The engine's worker threads start from a prebuilt JavaScript bundle of `engine-task.ts` (docs/decisions/0014), built
// the way the `calc` bundles are (docs/decisions/0013): esbuild, minified, CommonJS, into .cache/engine/build-…/, with
// .cache/engine/manifest.json naming the build and every source file that went into it. A worker reads the manifest,
// checks that no source is newer than it (or gone), and runs the bundle through `vm.Script` with V8's code cache kept
// beside it; a missing or stale build is built first (esbuild is imported only then), by one process at a time.
import { mkdirSync, readdirSync, rmSync, rmdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { threadId } from 'node:worker_threads';
import process from 'node:process';
import { mtimeMs, nodeBundleOptions, readFreshManifest, runCachedBundle, writeManifest } from '../lib/cached-bundle.mjs';
import { setTimeout } from 'node:timers';

export const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const defaultCacheDir = join(root, '.cache', 'engine');
const entry = 'server/workers/engine-task.ts';
const bundleName = 'engine-task.cjs';
const manifestVersion = 1;
/** A build older than this whose folder the manifest no longer names is removed. */
const staleAfterMs = 60_000;
/**
 * A build lock older than this is taken over: its holder was ended mid-build (a worker terminated by a time limit or by
 * the pool's closing). A build takes about a second; two at once are harmless, only wasteful.
 */
const lockStaleAfterMs = 10_000;

/** The manifest in `cacheDir` when it exists and no recorded source is newer than it (or gone); else null. */
export function freshManifest(cacheDir = defaultCacheDir) {
  const manifest = readFreshManifest(join(cacheDir, 'manifest.json'), root, manifestVersion);
  return manifest && typeof manifest.build === 'string' ? manifest : null;
}

/** Builds the bundle into a new folder of `cacheDir` and renames the manifest into place (atomic); returns it. */
export async function buildEngineBundle(cacheDir = defaultCacheDir) {
  const esbuild = await import('esbuild');
  mkdirSync(cacheDir, { recursive: true });
  const buildName = `build-${Date.now().toString(36)}-${process.pid}-${threadId}`;
  const outdir = join(cacheDir, buildName);
  const result = await esbuild.build({ ...nodeBundleOptions, entryPoints: { 'engine-task': entry }, outdir, absWorkingDir: root });
  const inputs = new Set(['package.json', 'package-lock.json', 'server/workers/engine-bundle.mjs', 'server/lib/cached-bundle.mjs']);
  for (const path of Object.keys(result.metafile.inputs)) if (!path.includes(':') && !path.includes('node_modules')) inputs.add(path);
  const manifest = { version: manifestVersion, build: buildName, inputs: [...inputs] };
  writeManifest(join(cacheDir, 'manifest.json'), manifest);
  for (const name of readdirSync(cacheDir)) {
    if (!name.startsWith('build-') || name === buildName) continue;
    const path = join(cacheDir, name);
    if (Date.now() - mtimeMs(path) > staleAfterMs) rmSync(path, { recursive: true, force: true });
  }
  return manifest;
}

const sleep = (ms) => new Promise((done) => setTimeout(done, ms));

/**
 * A fresh manifest, building one when there is none. Several workers (and server processes) start at once: the first
 * takes a lock folder and builds, the others wait for its manifest (or take the lock over once it is 10 s old).
 */
export async function ensureEngineBundle(cacheDir = defaultCacheDir) {
  const fresh = freshManifest(cacheDir);
  if (fresh) return fresh;
  mkdirSync(cacheDir, { recursive: true });
  const lock = join(cacheDir, 'building.lock');
  for (;;) {
    try {
      mkdirSync(lock);
      break;
    } catch (error) {
      if (error?.code !== 'EEXIST') throw error;
      const held = mtimeMs(lock);
      if (held >= 0 && Date.now() - held > lockStaleAfterMs) {
        rmSync(lock, { recursive: true, force: true });
        continue;
      }
      await sleep(50);
      const built = freshManifest(cacheDir);
      if (built) return built;
    }
  }
  try {
    return freshManifest(cacheDir) ?? (await buildEngineBundle(cacheDir));
  } finally {
    try {
      rmdirSync(lock);
    } catch {
      // Removed already as stale by another process.
    }
  }
}

/**
 * Runs the bundle of `manifest` (CommonJS through `vm.Script`, with V8's code cache from beside it when there is one)
 * and returns its exports with `writeCodeCache()`, to be called once the first task has run so that the cache holds
 * the functions that ran compiled; it writes only when the cache was missing or refused (another Node version).
 */
export function loadEngineBundle(manifest, cacheDir = defaultCacheDir) {
  return { ...runCachedBundle(join(cacheDir, manifest.build, bundleName)), build: manifest.build };
}

// `node server/workers/engine-bundle.mjs` (part of `npm run build`): builds the bundle unless a fresh one is there.
if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const manifest = await ensureEngineBundle();
  process.stdout.write(`engine bundle: ${join(defaultCacheDir, manifest.build)}\n`);
}
