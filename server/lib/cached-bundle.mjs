// A CommonJS bundle run with V8's code cache, shared by the `calc` launcher (server/cli/calc.mjs) and the engine
// workers' bundle (server/workers/engine-bundle.mjs): both build minified bundles with esbuild into .cache/ and start
// them through `vm.Script`, which takes the cache that `node` itself would not keep (docs/decisions/0013).
import { readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
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
