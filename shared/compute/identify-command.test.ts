import { describe, expect, it } from 'vitest';
import { getComputeCommand } from './commands';
import { toApiIssues } from '../contracts/errors';
import { identifyResponseSchema } from '../contracts/identify';
import { ambientRecord, decayRecord } from '../engine/signal/test-records';

const identify = getComputeCommand('identify')!;
const paths = (body: unknown) => {
  const parsed = identify.request.safeParse(body);
  return parsed.success ? [] : toApiIssues(parsed.error).map((issue) => issue.path);
};

describe('identify command', () => {
  it('answers an ambient record with the spectrum method and a schema-valid answer', () => {
    const record = Array.from(ambientRecord({ frequencyHz: 2.2, dampingRatio: 0.01, sampleRateHz: 40 }, 1200, 8, { forceStd: 0.02 }));
    const answer = identify.run(identify.request.parse({ sampleRateHz: 40, accelerationMPerS2: record, bandHz: [1, 5] }));
    expect(identifyResponseSchema.parse(answer)).toEqual(answer);
    expect(answer.method).toBe('spectrum');
    expect(answer.bandHz).toEqual([1, 5]);
    expect(Math.abs(answer.frequencyHz / 2.2 - 1)).toBeLessThan(5e-3);
    expect(answer.spectrum.frequencyHz.length).toBe(answer.spectrum.psdM2PerS4PerHz.length);
    expect(answer.spectrum.frequencyHz.at(-1)).toBeLessThanOrEqual(10);
    expect(answer.spectrumFit.curve.frequencyHz.length).toBe(answer.spectrumFit.lineCount);
    expect(answer.decay).toBeUndefined();
  });

  it('answers a free decay with the envelope and the fitted line for a plot', () => {
    const record = Array.from(decayRecord({ frequencyHz: 2.2, dampingRatio: 0.01, sampleRateHz: 40 }, 40, 8, { noiseStd: 1e-4, quietS: 2 }));
    const answer = identify.run(identify.request.parse({ sampleRateHz: 40, accelerationMPerS2: record, method: 'decay' }));
    expect(identifyResponseSchema.parse(answer)).toEqual(answer);
    expect(answer.methodChosenBy).toBe('request');
    expect(answer.decay.timesS.length).toBe(answer.decay.envelopeMPerS2.length);
    expect(answer.decay.fit.timesS.length).toBe(answer.decay.fit.envelopeMPerS2.length);
    expect(Math.abs(answer.dampingRatio / 0.01 - 1)).toBeLessThan(0.03);
  });

  const ok = { sampleRateHz: 50, accelerationMPerS2: new Array(3000).fill(0) };
  it('refuses bad records naming the field', () => {
    expect(paths(ok)).toEqual([]);
    // JSON.parse turns 1e999 into Infinity and an empty slot into null.
    const samples = JSON.parse(`[${new Array(3000).fill(0).join(',')}]`);
    samples[12] = Infinity;
    samples[99] = null;
    expect(paths({ ...ok, accelerationMPerS2: samples })).toEqual(['accelerationMPerS2.12', 'accelerationMPerS2.99']);
    expect(paths({ ...ok, accelerationMPerS2: new Array(100).fill(0) })).toEqual(['accelerationMPerS2']);
    expect(paths({ ...ok, accelerationMPerS2: 'many' })).toEqual(['accelerationMPerS2']);
    expect(paths({ ...ok, bandHz: [1, 30] })).toEqual(['bandHz']);
    expect(paths({ ...ok, bandHz: [-1, 3] })).toEqual(['bandHz']);
    expect(paths({ ...ok, bandHz: [1] })).toEqual(['bandHz']);
    expect(paths({ accelerationMPerS2: ok.accelerationMPerS2 })).toEqual(['sampleRateHz']);
    expect(paths({ ...ok, sampleRateHz: 0 })).toEqual(['sampleRateHz']);
    expect(paths({ ...ok, method: 'guess' })).toEqual(['method']);
    expect(paths({ ...ok, window: 'flat' })).toEqual(['window']);
  });

  it('bounds the record length at 2²² samples', () => {
    expect(paths({ sampleRateHz: 1000, accelerationMPerS2: new Array(2 ** 22 + 1).fill(0) })).toEqual(['accelerationMPerS2']);
  });

  it('messages name the field and the rule', () => {
    const parsed = identify.request.safeParse({ ...ok, bandHz: [1, 30] });
    expect(parsed.success).toBe(false);
    if (!parsed.success) expect(toApiIssues(parsed.error)[0].message).toMatch(/^bandHz: must be \[low, high\] with 0 < low < high < the Nyquist frequency 25 Hz/);
  });
});
