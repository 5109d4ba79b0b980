/**
 * The engine's prebuilt bundle (engine-bundle.mjs) against the TypeScript sources it is built from: the same task gives
 * the same answer, character for character, whether the bundle runs in this thread or in the pool's workers; a build
 * older than a source is not used but built again. The requests are test inputs of our own (the records are synthetic
 * single-DOF oscillators made by the test helpers), not site data; the engineering itself is checked elsewhere.
 */
import { existsSync, mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ambientRecord } from '../../shared/engine/signal/test-records';
import { createEnginePool, type EnginePool } from './engine-pool';
import { buildEngineBundle, ensureEngineBundle, freshManifest, loadEngineBundle } from './engine-bundle.mjs';
import { runEngineTask, type EngineTask, type EngineTaskResult } from './engine-task';

const structure = { modalMassKg: 36_000, frequencyHz: 2.02, dampingRatio: 0.006, direction: 'vertical' };
const crowd = { kind: 'crowd', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 150, modeShapeMean: 2 / Math.PI };
const requests: Record<string, unknown> = {
  assess: { structure, tmds: [{ massKg: 720, frequencyHz: 1.97, dampingRatio: 0.075 }], loadCase: crowd, criteria: { set: 'hivoss', class: 'CL2' } },
  identify: { sampleRateHz: 20, accelerationMPerS2: Array.from(ambientRecord({ frequencyHz: 1.9, dampingRatio: 0.012, sampleRateHz: 20 }, 600, 31, { forceStd: 0.02 })) },
};
const maxAnswerBytes = 16e6;

let cacheDir: string;

beforeAll(() => {
  cacheDir = mkdtempSync(join(tmpdir(), 'stillspan-engine-bundle-'));
});

afterAll(() => {
  rmSync(cacheDir, { recursive: true, force: true });
});

function fromSources(command: string): EngineTaskResult {
  return runEngineTask({ command, request: requests[command], maxAnswerBytes });
}

describe('the engine bundle', () => {
  it('answers assess and identify exactly as the sources do, and writes its code cache once', async () => {
    const manifest = await ensureEngineBundle(cacheDir);
    const bundle = loadEngineBundle(manifest, cacheDir) as { exports: { runEngineTask(task: EngineTask): EngineTaskResult }; writeCodeCache(): void };
    for (const command of Object.keys(requests)) {
      const answer = bundle.exports.runEngineTask({ command, request: requests[command], maxAnswerBytes });
      const expected = fromSources(command);
      expect(expected.ok, command).toBe(true);
      expect(answer, command).toEqual(expected);
    }
    const cacheFile = join(cacheDir, manifest.build, 'engine-task.cjs.v8cache');
    expect(existsSync(cacheFile)).toBe(false);
    bundle.writeCodeCache();
    expect(existsSync(cacheFile)).toBe(true);
    // A second load takes the cache V8 wrote and compiles nothing again.
    const again = loadEngineBundle(manifest, cacheDir) as { exports: { runEngineTask(task: EngineTask): EngineTaskResult } };
    expect(again.exports.runEngineTask({ command: 'assess', request: requests.assess, maxAnswerBytes })).toEqual(fromSources('assess'));
  }, 60_000);

  it('is not used once a source is newer than its build: it is built again', async () => {
    const first = await ensureEngineBundle(cacheDir);
    expect(freshManifest(cacheDir)?.build).toBe(first.build);
    // The manifest's time is the build's: set it back before every source, as if the sources had changed since.
    const past = new Date('2001-01-01T00:00:00Z');
    utimesSync(join(cacheDir, 'manifest.json'), past, past);
    expect(freshManifest(cacheDir)).toBeNull();
    const second = await ensureEngineBundle(cacheDir);
    expect(second.build).not.toBe(first.build);
    expect(freshManifest(cacheDir)?.build).toBe(second.build);
    expect(second.inputs).toEqual(expect.arrayContaining(['server/workers/engine-task.ts', 'shared/compute/commands.ts', 'package-lock.json']));
  }, 60_000);

  it('takes over a build lock left by a worker ended mid-build', async () => {
    const before = await ensureEngineBundle(cacheDir);
    const past = new Date('2001-01-01T00:00:00Z');
    utimesSync(join(cacheDir, 'manifest.json'), past, past);
    const lock = join(cacheDir, 'building.lock');
    mkdirSync(lock);
    utimesSync(lock, past, past);
    const started = performance.now();
    const after = await ensureEngineBundle(cacheDir);
    expect(after.build).not.toBe(before.build);
    expect(existsSync(lock)).toBe(false);
    expect(performance.now() - started).toBeLessThan(30_000);
  }, 60_000);

  it('records a source that is gone as stale', async () => {
    const manifest = await buildEngineBundle(cacheDir);
    writeFileSync(join(cacheDir, 'manifest.json'), JSON.stringify({ ...manifest, inputs: [...manifest.inputs, 'server/workers/no-such-source.ts'] }));
    expect(freshManifest(cacheDir)).toBeNull();
  }, 60_000);
});

describe('the pool from the bundle and from the sources', () => {
  let bundled: EnginePool;
  let sources: EnginePool;

  beforeAll(() => {
    bundled = createEnginePool({ threads: 1, taskTimeoutMs: 60_000, maxAnswerBytes, engineCacheDir: cacheDir });
    sources = createEnginePool({ threads: 1, taskTimeoutMs: 60_000, maxAnswerBytes, engineCode: 'sources' });
  });

  afterAll(async () => {
    await Promise.all([bundled?.close(), sources?.close()]);
  });

  it('gives the same assess and identify answers, digit for digit', async () => {
    expect(await bundled.engineOrigin()).toMatch(/^bundle build-/);
    expect(await sources.engineOrigin()).toBe('sources');
    for (const command of Object.keys(requests)) {
      const [fromBundle, fromTs] = await Promise.all([bundled.runCommand(command, requests[command]), sources.runCommand(command, requests[command])]);
      expect(fromBundle, command).toBe(fromTs);
      const expected = fromSources(command);
      expect(expected.ok && expected.json, command).toBe(fromBundle);
    }
  }, 120_000);
});
