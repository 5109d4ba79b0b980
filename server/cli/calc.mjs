#!/usr/bin/env node
// Launcher of the `calc` command. Node 20 cannot run TypeScript, and a TypeScript loader costs a few hundred
// milliseconds at every start, so calc.ts and what it imports are bundled once by esbuild into
// .cache/calc/calc.mjs and that bundle is imported directly. The bundle is rebuilt when it is missing or when any
// of the source files esbuild recorded in its metafile is newer than it (or gone). See docs/decisions/0008-calc-launcher.md.
import { statSync, readFileSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import process from 'node:process';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const entry = join(root, 'server', 'cli', 'calc.ts');
const cacheDir = join(root, '.cache', 'calc');
const bundle = join(cacheDir, 'calc.mjs');
const inputsFile = join(cacheDir, 'inputs.json');

function mtimeMs(path) {
  try {
    return statSync(path).mtimeMs;
  } catch {
    return -1;
  }
}

function isFresh() {
  const built = mtimeMs(bundle);
  if (built < 0) return false;
  let inputs;
  try {
    inputs = JSON.parse(readFileSync(inputsFile, 'utf8'));
  } catch {
    return false;
  }
  if (!Array.isArray(inputs) || inputs.length === 0) return false;
  for (const input of inputs) {
    const time = mtimeMs(join(root, input));
    if (time < 0 || time > built) return false;
  }
  return true;
}

async function build() {
  const esbuild = await import('esbuild');
  mkdirSync(cacheDir, { recursive: true });
  const temporary = `${bundle}.${process.pid}.tmp`;
  const result = await esbuild.build({
    entryPoints: [entry],
    outfile: temporary,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    metafile: true,
    logLevel: 'error',
    absWorkingDir: root,
  });
  const inputs = Object.keys(result.metafile.inputs).filter((path) => !path.includes('node_modules'));
  inputs.push('package.json', 'package-lock.json', 'server/cli/calc.mjs');
  // Rename is atomic: a concurrent calc never reads a half-written bundle.
  writeFileSync(`${inputsFile}.${process.pid}.tmp`, JSON.stringify(inputs));
  renameSync(temporary, bundle);
  renameSync(`${inputsFile}.${process.pid}.tmp`, inputsFile);
}

if (!isFresh()) await build();
const calc = await import(pathToFileURL(bundle).href);
// `npm run calc` runs from the package root and records the directory the command was typed in as INIT_CWD:
// relative request paths are meant from there. Started any other way, the working directory counts.
const launchedByNpm = process.env.npm_lifecycle_event === 'calc' && process.env.INIT_CWD;
calc.main(process.argv.slice(2), launchedByNpm ? process.env.INIT_CWD : process.cwd());
