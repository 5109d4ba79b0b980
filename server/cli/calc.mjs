#!/usr/bin/env node
// Launcher of the `calc` command (docs/decisions/0008-calc-launcher.md, 0013-calc-start-up.md). Node 20 cannot run
// TypeScript and a TypeScript loader costs a few hundred milliseconds at every start, so the sources are bundled by
// esbuild, minified, into .cache/calc/<build>/: a small core (arguments, reading, exit codes; no command, no zod) and,
// for each module of commands that shared/compute/commands.ts imports, one bundle with that module and the core. A run
// reads .cache/calc/manifest.json (every command's summary and bundle, and the source files of the build), checks that
// no source is newer than the manifest, and loads only the bundle of the command asked for (`--help` and an unknown
// command only the core), with V8's code cache kept beside each bundle so that its functions are not compiled again
// at every start. A missing or stale build is rebuilt first (esbuild is imported only then).
import { mkdirSync, readdirSync, rmSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import process from 'node:process';
import { mtimeMs, nodeBundleOptions, readFreshManifest, runCachedBundle, writeManifest } from '../lib/cached-bundle.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const cacheDir = join(root, '.cache', 'calc');
const manifestFile = join(cacheDir, 'manifest.json');
const registry = 'shared/compute/commands.ts';
const core = 'server/cli/calc-core.ts';
const errorsModule = 'shared/contracts/errors.ts';

/** The manifest when it exists and no recorded source is newer than it (or gone); else null. */
function freshManifest() {
  return readFreshManifest(manifestFile, root, 3);
}

/**
 * zod's `z` namespace re-exports every locale and the JSON-schema converters, which esbuild cannot drop from a
 * namespace: about 450 kB of the minified bundle that calc never runs. The bundle gets the same classic API without
 * them (the English messages stay: zod registers them on the first schema). A member missing here is a build error.
 */
const leanZod = {
  name: 'lean-zod',
  setup(build) {
    const classic = join(root, 'node_modules', 'zod', 'v4', 'classic');
    build.onResolve({ filter: /^zod$/ }, () => ({ path: 'zod', namespace: 'lean-zod' }));
    build.onLoad({ filter: /.*/, namespace: 'lean-zod' }, () => ({
      resolveDir: classic,
      contents: [
        "export * as z from './external-lean.js';",
        "export * from './external-lean.js';",
      ].join('\n'),
    }));
    build.onResolve({ filter: /^\.\/external-lean\.js$/ }, () => ({ path: 'external-lean', namespace: 'lean-zod-api' }));
    build.onLoad({ filter: /.*/, namespace: 'lean-zod-api' }, () => ({
      resolveDir: classic,
      contents: [
        "export * from './schemas.js';",
        "export * from './checks.js';",
        "export * from './errors.js';",
        "export * from './parse.js';",
        "export * from './compat.js';",
        "export { globalRegistry, registry, config, $output, $input, $brand, clone, regexes, treeifyError, prettifyError, formatError, flattenError, TimePrecision, util, NEVER } from '../core/index.js';",
        "export { input, output } from './in-out.js';",
        "export * as coerce from './coerce.js';",
      ].join('\n'),
    }));
  },
};

/** Entries made of re-exports: `calc-entry:<module>` = the module's exports, the core and toApiIssues, in one bundle. */
const entries = {
  name: 'calc-entries',
  setup(build) {
    build.onResolve({ filter: /^calc-entry:/ }, (args) => ({ path: args.path.slice('calc-entry:'.length), namespace: 'calc-entry' }));
    build.onLoad({ filter: /.*/, namespace: 'calc-entry' }, (args) => ({
      resolveDir: root,
      loader: 'js',
      contents: [args.path, core]
        .map((path) => `export * from ${JSON.stringify(`./${path}`)};`)
        .concat(`export { toApiIssues } from ${JSON.stringify(`./${errorsModule}`)};`)
        .join('\n'),
    }));
  },
};

/** The bundles run so far, whose code cache is written after the command has run (with what it compiled). */
const pendingCaches = [];

/** Runs a CommonJS bundle of the build, with V8's code cache from beside it when there is one. */
function loadBundle(file) {
  const loaded = runCachedBundle(file);
  pendingCaches.push(loaded);
  return loaded.exports;
}

function writeCodeCaches() {
  for (const loaded of pendingCaches.splice(0)) loaded.writeCodeCache();
}

function isCommand(value) {
  return value !== null && typeof value === 'object' && typeof value.name === 'string' && typeof value.summary === 'string'
    && typeof value.run === 'function' && typeof value.request?.safeParse === 'function';
}

async function build() {
  const esbuild = await import('esbuild');
  // The modules of commands are what the registry imports.
  const probe = await esbuild.build({ entryPoints: [registry], bundle: true, write: false, metafile: true, platform: 'node', format: 'esm', logLevel: 'error', absWorkingDir: root, plugins: [leanZod] });
  const modules = probe.metafile.inputs[registry].imports.map((entry) => entry.path).filter((path) => !path.includes('node_modules'));
  const entryPoints = { core, all: `calc-entry:${registry}` };
  modules.forEach((path, i) => {
    entryPoints[`commands-${i}`] = `calc-entry:${path}`;
  });
  mkdirSync(cacheDir, { recursive: true });
  const buildName = `build-${Date.now().toString(36)}-${process.pid}`;
  const outdir = join(cacheDir, buildName);
  const result = await esbuild.build({ ...nodeBundleOptions, entryPoints, outdir, absWorkingDir: root, plugins: [leanZod, entries] });
  // Every command of the registry, and the bundle (module of commands) that holds it; the registry's own bundle
  // answers for a command defined anywhere else. (Loading them here leaves no code cache: the first run writes it.)
  const all = loadBundle(join(outdir, 'all.cjs'));
  pendingCaches.length = 0;
  const commands = {};
  for (const [name, command] of Object.entries(all.computeCommands)) {
    commands[name] = { summary: command.summary, bundle: 'all.cjs', record: 'computeCommands' };
  }
  for (let i = 0; i < modules.length; i++) {
    const bundle = `commands-${i}.cjs`;
    const exports = loadBundle(join(outdir, bundle));
    pendingCaches.length = 0;
    for (const [record, value] of Object.entries(exports)) {
      if (value === null || typeof value !== 'object') continue;
      for (const [name, command] of Object.entries(value)) {
        const known = commands[name];
        if (known?.bundle === 'all.cjs' && isCommand(command) && command.name === name && command.summary === known.summary) {
          commands[name] = { summary: known.summary, bundle, record };
        }
      }
    }
  }
  const inputs = new Set(['package.json', 'package-lock.json', 'server/cli/calc.mjs', 'server/lib/cached-bundle.mjs']);
  for (const path of Object.keys(probe.metafile.inputs)) if (!path.includes(':') && !path.includes('node_modules')) inputs.add(path);
  for (const path of Object.keys(result.metafile.inputs)) if (!path.includes(':') && !path.includes('node_modules')) inputs.add(path);
  const manifest = { version: 3, build: buildName, inputs: [...inputs], commands };
  // Rename is atomic: a concurrent calc reads either the old manifest (whose build stays) or the new one.
  writeManifest(manifestFile, manifest);
  // Builds older than a minute that the manifest no longer names are left from earlier sources: remove them.
  for (const name of readdirSync(cacheDir)) {
    if (!name.startsWith('build-') || name === buildName) continue;
    const path = join(cacheDir, name);
    if (Date.now() - mtimeMs(path) > 60_000) rmSync(path, { recursive: true, force: true });
  }
  return manifest;
}

const args = process.argv.slice(2);
const manifest = freshManifest() ?? (await build());
const summaries = {};
for (const [name, entry] of Object.entries(manifest.commands)) summaries[name] = entry.summary;
const name = args.length === 2 && Object.prototype.hasOwnProperty.call(manifest.commands, args[0]) ? args[0] : null;
const outdir = join(cacheDir, manifest.build);
// The command's bundle carries the core; without a command to run, the core alone.
const bundle = loadBundle(join(outdir, name === null ? 'core.cjs' : manifest.commands[name].bundle));
const catalogue = {
  summaries,
  load(wanted) {
    const entry = manifest.commands[wanted];
    return { command: bundle[entry.record][wanted], toApiIssues: bundle.toApiIssues };
  },
};
// `npm run calc` runs from the package root and records the directory the command was typed in as INIT_CWD:
// relative request paths are meant from there. Started any other way, the working directory counts.
const launchedByNpm = process.env.npm_lifecycle_event === 'calc' && process.env.INIT_CWD;
bundle.mainWith(args, launchedByNpm ? process.env.INIT_CWD : process.cwd(), catalogue);
writeCodeCaches();
