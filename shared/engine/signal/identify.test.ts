import { describe, expect, it } from 'vitest';
import { checkIdentifyInput, identifyMode, MAX_SAMPLES } from './identify';
import { ambientRecord, decayRecord, seededNormal } from './test-records';
import { EngineInputError } from '../linalg';

/**
 * Site records made in the test: a single-DOF oscillator driven by seeded white noise and integrated exactly
 * (ambient), or its closed-form free decay, each with white measurement noise. Tolerances reached:
 * ambient, long record (πζf·T ≈ 1000): f within 0.2 %, ζ within 10 %; 30-minute records (πζf·T ≈ 84): no bias
 * (mean of 12 records within 6 %), a scatter of about 1/√(πζf·T) ≈ 11 % at 1σ (measured 12.6 % over 40 records, 17 % over these 12:
 * the statistics of a finite record, not a flaw of the method), so single records within 40 % (3σ);
 * free decay: f within 0.05 %, ζ within 3 %.
 */
describe('identifyMode', () => {
  it('ambient response, long record: f within 0.2 %, ζ within 10 % (three records)', () => {
    const oscillator = { frequencyHz: 2, dampingRatio: 0.01, sampleRateHz: 20 };
    for (const seed of [21, 22, 23]) {
      const record = ambientRecord(oscillator, 16_000, seed, { forceStd: 0.05, noiseStd: 0.002 });
      const result = identifyMode(record, oscillator.sampleRateHz);
      expect(result.method).toBe('spectrum');
      expect(result.methodChosenBy).toBe('record');
      expect(Math.abs(result.frequencyHz! / 2 - 1)).toBeLessThan(2e-3);
      expect(Math.abs(result.dampingRatio! / 0.01 - 1)).toBeLessThan(0.1);
      expect(result.spectrumFit!.rSquared).toBeGreaterThan(0.8);
      // The resolution chosen gives about two lines per half-power bandwidth 2ζf = 0.04 Hz.
      expect(result.spectrum.resolutionHz).toBeLessThanOrEqual(0.02);
      expect(result.warnings).toEqual([]);
    }
  }, 30_000);

  it('ambient response, 30-minute records: unbiased over 12 records, scatter as a finite record allows', () => {
    const oscillator = { frequencyHz: 1.85, dampingRatio: 0.008, sampleRateHz: 25 };
    const errors: number[] = [];
    for (let seed = 1; seed <= 12; seed++) {
      const record = ambientRecord(oscillator, 1800, seed, { forceStd: 0.05, noiseStd: 0.002 });
      const result = identifyMode(record, oscillator.sampleRateHz, { bandHz: [1, 4] });
      expect(Math.abs(result.frequencyHz! / oscillator.frequencyHz - 1)).toBeLessThan(5e-3);
      errors.push(result.dampingRatio! / oscillator.dampingRatio - 1);
    }
    const mean = errors.reduce((a, b) => a + b, 0) / errors.length;
    const scatter = Math.sqrt(errors.reduce((a, b) => a + (b - mean) ** 2, 0) / (errors.length - 1));
    expect(Math.abs(mean)).toBeLessThan(0.06);
    expect(scatter).toBeLessThan(0.2);
    for (const error of errors) expect(Math.abs(error)).toBeLessThan(0.4);
  }, 30_000);

  it('free decay after a quiet lead-in: chosen from the record, f within 0.05 %, ζ within 3 %', () => {
    const oscillator = { frequencyHz: 2.3, dampingRatio: 0.007, sampleRateHz: 100 };
    const record = decayRecord(oscillator, 45, 3, { initialVelocityMPerS: 0.005, noiseStd: 1e-4, quietS: 3 });
    const result = identifyMode(record, oscillator.sampleRateHz);
    expect(result.method).toBe('decay');
    expect(result.methodNote).toMatch(/free decay/);
    expect(Math.abs(result.frequencyHz! / 2.3 - 1)).toBeLessThan(5e-4);
    expect(Math.abs(result.dampingRatio! / 0.007 - 1)).toBeLessThan(0.03);
    expect(result.decay?.found).toBe(true);
    expect(result.halfPower).toBeNull();
  });

  it('a single heel drop in a long quiet record: the spectrum of the decay alone locates the mode', () => {
    // 20 minutes of sensor noise with one free decay starting at 300 s.
    const oscillator = { frequencyHz: 1.7, dampingRatio: 0.009, sampleRateHz: 50 };
    const record = decayRecord(oscillator, 1200, 6, { initialVelocityMPerS: 0.005, noiseStd: 2e-4, quietS: 300 });
    const result = identifyMode(record, oscillator.sampleRateHz, { method: 'decay' });
    expect(Math.abs(result.frequencyHz! / 1.7 - 1)).toBeLessThan(5e-4);
    expect(Math.abs(result.dampingRatio! / 0.009 - 1)).toBeLessThan(0.03);
  });

  it('keeps to the requested method and to the band (a second, stronger mode outside it is ignored)', () => {
    const fs = 40;
    const a = ambientRecord({ frequencyHz: 2, dampingRatio: 0.01, sampleRateHz: fs }, 7200, 4, { forceStd: 0.05 });
    const b = ambientRecord({ frequencyHz: 6, dampingRatio: 0.01, sampleRateHz: fs }, 7200, 5, { forceStd: 0.2 });
    const both = a.map((value, i) => value + b[i]);
    const low = identifyMode(both, fs, { bandHz: [1, 4], method: 'spectrum' });
    expect(low.methodChosenBy).toBe('request');
    expect(Math.abs(low.frequencyHz! / 2 - 1)).toBeLessThan(2e-3);
    const high = identifyMode(both, fs, { bandHz: [4.5, 9] });
    expect(Math.abs(high.frequencyHz! / 6 - 1)).toBeLessThan(2e-3);
  });

  it('a record without a mode in the band answers null with a warning instead of inventing one', () => {
    const normal = seededNormal(9);
    const noise = Float64Array.from({ length: 30_000 }, () => 0.01 * normal());
    const result = identifyMode(noise, 50, { method: 'spectrum' });
    expect(result.frequencyHz).toBeNull();
    expect(result.dampingRatio).toBeNull();
    expect(result.warnings.join(' ')).toMatch(/no clear peak/);
    expect(result.rmsAccelerationMPerS2).toBeCloseTo(0.01, 3);
  });

  it('a constant record says there is nothing to identify', () => {
    const result = identifyMode(new Float64Array(3000).fill(0.02), 50);
    expect(result.frequencyHz).toBeNull();
    expect(result.dampingRatio).toBeNull();
    expect(result.warnings).toEqual([expect.stringMatching(/constant/)]);
    expect(result.peakAccelerationMPerS2).toBeLessThan(1e-12);
  });

  it('reports the peak and RMS of the record about its mean (an offset such as a tilted sensor is removed)', () => {
    const record = Float64Array.from({ length: 4000 }, (_, i) => 9.81 + 0.2 * Math.sin((2 * Math.PI * 2 * i) / 100));
    const result = identifyMode(record, 100, { method: 'spectrum' });
    expect(result.peakAccelerationMPerS2).toBeCloseTo(0.2, 3);
    expect(result.rmsAccelerationMPerS2).toBeCloseTo(0.2 / Math.SQRT2, 4);
  });
});

describe('checkIdentifyInput (the refusals, naming the field)', () => {
  const ok = new Float64Array(2000);
  const paths = (issues: { path: string }[]) => issues.map((issue) => issue.path);

  it('accepts a sound record', () => {
    expect(checkIdentifyInput(50, ok)).toEqual([]);
    expect(checkIdentifyInput(50, ok, [1, 4])).toEqual([]);
  });

  it('names a non-finite sample by its index', () => {
    const record = Array.from(ok);
    record[17] = NaN;
    record[40] = Infinity;
    const issues = checkIdentifyInput(50, record);
    expect(paths(issues)).toEqual(['accelerationMPerS2.17', 'accelerationMPerS2.40']);
    expect(issues[0].message).toMatch(/finite/);
  });

  it('refuses a record shorter than 10 periods of the band\u2019s lower edge, and one too long', () => {
    // 1000 samples at 50 Hz = 20 s < 10 periods of 0.4 Hz = 25 s.
    const issues = checkIdentifyInput(50, new Float64Array(1000), [0.4, 4]);
    expect(paths(issues)).toEqual(['accelerationMPerS2']);
    expect(issues[0].message).toMatch(/10 periods/);
    expect(paths(checkIdentifyInput(50, { length: MAX_SAMPLES + 1 }))).toEqual(['accelerationMPerS2']);
  });

  it('refuses a band outside (0, Nyquist) or upside down, and a missing or non-positive sample rate', () => {
    expect(paths(checkIdentifyInput(50, ok, [1, 25]))).toEqual(['bandHz']);
    expect(paths(checkIdentifyInput(50, ok, [0, 4]))).toEqual(['bandHz']);
    expect(paths(checkIdentifyInput(50, ok, [4, 2]))).toEqual(['bandHz']);
    expect(paths(checkIdentifyInput(0, ok))).toEqual(['sampleRateHz']);
    expect(paths(checkIdentifyInput(undefined, ok))).toEqual(['sampleRateHz']);
    expect(paths(checkIdentifyInput(-5, ok))).toEqual(['sampleRateHz']);
  });

  it('identifyMode throws EngineInputError with the field', () => {
    expect(() => identifyMode(new Float64Array(100), 50)).toThrow(EngineInputError);
    try {
      identifyMode(new Float64Array(3000), 50, { bandHz: [1, 30] });
    } catch (error) {
      expect((error as EngineInputError).field).toBe('bandHz');
    }
  });
});
