// A CommonJS bundle run with V8's code cache, shared by the `calc` launcher (server/cli/calc.mjs) and the engine
// workers' bundle (server/workers/engine-bundle.mjs): both build minified bundles with esbuild into .cache/ and start
// them through `vm.Script`, which takes the cache that `node` itself would not keep (docs/decisions/0013).
import { readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { threadId } from 'node:worker_threads';
import { Script } from 'node:vm';
import process from 'node:process';

/** The esbuild options both bundles are built with (Node.js 20, CommonJS, minified); add entry points, outdir, root. */
export const nodeBundleOptions = {
  bundle: true,
  minify: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  outExtension: { '.js': '.cjs' },
  metafile: true,
  logLevel: 'error',
  logOverride: { 'import-is-undefined': 'error' },
};

/**
 * Runs the CommonJS bundle `file` with the code cache from beside it (`<file>.v8cache`) when there is one, and returns
 * its exports with `writeCodeCache()`: called once the work has run, so that the cache holds the functions that ran
 * compiled, it writes only when the cache was missing or refused (another Node version), and at most once.
 */
export function runCachedBundle(file) {
  const cacheFile = `${file}.v8cache`;
  let cachedData;
  try {
    cachedData = readFileSync(cacheFile);
  } catch {
    cachedData = undefined;
  }
  const source = `(function (exports, require, module, __filename, __dirname) {${readFileSync(file, 'utf8')}\n})`;
  const script = new Script(source, { filename: file, cachedData });
  let pending = cachedData === undefined || script.cachedDataRejected === true;
  const module = { exports: {} };
  script.runInThisContext()(module.exports, createRequire(file), module, file, dirname(file));
  return {
    exports: module.exports,
    writeCodeCache() {
      if (!pending) return;
      pending = false;
      try {
        const temporary = `${cacheFile}.${process.pid}-${threadId}.tmp`;
        writeFileSync(temporary, script.createCachedData());
        renameSync(temporary, cacheFile);
      } catch {
        // A cache is an optimisation only: without it the bundle is compiled as usual.
      }
    },
  };
}

/** A file's modification time in ms, or -1 when it is not there. */
export function mtimeMs(path) {
  try {
    return statSync(path).mtimeMs;
  } catch {
    return -1;
  }
}

/**
 * The build's manifest (`{ version, inputs: [paths relative to root], … }`) when it is of `version` and no recorded
 * source is newer than it or gone; else null (the build is missing or stale).
 */
export function readFreshManifest(manifestFile, root, version) {
  let manifest;
  let built;
  try {
    built = statSync(manifestFile).mtimeMs;
    manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
  } catch {
    return null;
  }
  if (manifest?.version !== version || !Array.isArray(manifest.inputs) || manifest.inputs.length === 0) return null;
  for (const input of manifest.inputs) {
    const time = mtimeMs(join(root, input));
    if (time < 0 || time > built) return null;
  }
  return manifest;
}

/** Writes the manifest by rename, so that a reader sees the old one or the new one, never half of one. */
export function writeManifest(manifestFile, manifest) {
  const temporary = `${manifestFile}.${process.pid}-${threadId}.tmp`;
  writeFileSync(temporary, JSON.stringify(manifest));
  renameSync(temporary, manifestFile);
}
