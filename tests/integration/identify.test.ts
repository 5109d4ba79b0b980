/**
 * POST /api/compute/identify and `calc identify`: the same JSON in and out, and the same refusals naming the field.
 * The records are synthetic (a single-DOF oscillator made in the test), not site data.
 */
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ambientRecord, decayRecord } from '../../shared/engine/signal/test-records';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signIn(t.app, t.people.engineer.email);
});

afterAll(async () => {
  await t?.close();
});

function runCalc(body: unknown) {
  return spawnSync(process.execPath, ['server/cli/calc.mjs', 'identify', '-'], { input: JSON.stringify(body), encoding: 'utf8' });
}

const oscillator = { frequencyHz: 1.9, dampingRatio: 0.012, sampleRateHz: 20 };
// About 200 kB of JSON per record, well inside the API's body limit.
const requests: Record<string, object> = {
  ambient: { sampleRateHz: 20, accelerationMPerS2: Array.from(ambientRecord(oscillator, 600, 31, { forceStd: 0.02 }), (a) => Number(a.toPrecision(6))) },
  decay: { sampleRateHz: 20, accelerationMPerS2: Array.from(decayRecord(oscillator, 50, 32, { noiseStd: 1e-4, quietS: 2 }), (a) => Number(a.toPrecision(6))) },
  'decay in a band, method named': {
    sampleRateHz: 20,
    accelerationMPerS2: Array.from(decayRecord(oscillator, 50, 33, { noiseStd: 1e-4, quietS: 2 }), (a) => Number(a.toPrecision(6))),
    bandHz: [1, 4],
    method: 'decay',
  },
};

describe('identify through the API and calc', () => {
  it.each(Object.keys(requests))('%s: the API answers exactly as the calc command does', async (name) => {
    const body = requests[name];
    const api = await engineer.post('/api/compute/identify').send(body);
    expect(api.status, JSON.stringify(api.body).slice(0, 500)).toBe(200);
    const cli = runCalc(body);
    expect(cli.status, cli.stderr).toBe(0);
    expect(api.body).toEqual(JSON.parse(cli.stdout));
    expect(Math.abs(api.body.frequencyHz / oscillator.frequencyHz - 1)).toBeLessThan(0.005);
    expect(api.body.method).toBe(name === 'ambient' ? 'spectrum' : 'decay');
  });

  const bad: [string, object, string][] = [
    ['a non-finite sample', { sampleRateHz: 20, accelerationMPerS2: [...new Array(500).fill(0), 'NaN', ...new Array(500).fill(0)] }, 'accelerationMPerS2.500'],
    ['a record too short for the band', { sampleRateHz: 20, accelerationMPerS2: new Array(200).fill(0), bandHz: [0.5, 5] }, 'accelerationMPerS2'],
    ['a band beyond Nyquist', { sampleRateHz: 20, accelerationMPerS2: new Array(2000).fill(0), bandHz: [1, 12] }, 'bandHz'],
    ['no sample rate', { accelerationMPerS2: new Array(2000).fill(0) }, 'sampleRateHz'],
    ['a negative sample rate', { sampleRateHz: -20, accelerationMPerS2: new Array(2000).fill(0) }, 'sampleRateHz'],
  ];
  it.each(bad)('%s is refused by both, naming the field (400 / exit 2)', async (_, body, path) => {
    const api = await engineer.post('/api/compute/identify').send(body);
    expect(api.status).toBe(400);
    expect(api.body.error.code).toBe('invalid_request');
    expect(api.body.error.issues.map((issue: { path: string }) => issue.path)).toEqual([path]);
    const cli = runCalc(body);
    expect(cli.status).toBe(2);
    const error = JSON.parse(cli.stderr.trim().split('\n').at(-1)!);
    expect(error.error.issues).toEqual(api.body.error.issues);
  });
});
