import { describe, expect, it } from 'vitest';
import { chooseSegmentLength, hannWindow, welchPsd, welchSegmentCount } from './welch';
import { seededNormal } from './test-records';

describe('Welch power spectral density', () => {
  it('the periodic Hann window has Σw = N/2 and Σw² = 3N/8 (Harris 1978)', () => {
    const w = hannWindow(512);
    expect(w.reduce((a, b) => a + b, 0)).toBeCloseTo(256, 9);
    expect(w.reduce((a, b) => a + b * b, 0)).toBeCloseTo(192, 9);
  });

  it('white noise of variance σ² has the one-sided density 2σ²/f_s, and Σ P Δf is its variance (Parseval)', () => {
    const normal = seededNormal(11);
    const sigma = 0.2;
    const fs = 100;
    const x = Float64Array.from({ length: 200_000 }, () => sigma * normal());
    const spectrum = welchPsd(x, fs, 1024);
    let mean = 0;
    let total = 0;
    for (let k = 1; k < spectrum.psd.length - 1; k++) mean += spectrum.psd[k];
    mean /= spectrum.psd.length - 2;
    for (let k = 0; k < spectrum.psd.length; k++) total += spectrum.psd[k] * spectrum.resolutionHz;
    expect(mean / ((2 * sigma * sigma) / fs)).toBeCloseTo(1, 2);
    expect(total / (sigma * sigma)).toBeCloseTo(1, 2);
    expect(spectrum.segmentCount).toBe(welchSegmentCount(200_000, 1024));
    expect(spectrum.segmentCount).toBe(389);
  });

  it('a sine of amplitude A puts A²/2 under its peak (Parseval), at its own frequency', () => {
    const fs = 64;
    const f = 5.3;
    const x = Float64Array.from({ length: 65_536 }, (_, i) => 2 * Math.sin((2 * Math.PI * f * i) / fs));
    const spectrum = welchPsd(x, fs, 2048);
    let peak = 0;
    for (let k = 1; k < spectrum.psd.length; k++) if (spectrum.psd[k] > spectrum.psd[peak]) peak = k;
    expect(Math.abs(spectrum.frequencyHz[peak] - f)).toBeLessThanOrEqual(spectrum.resolutionHz / 2);
    let power = 0;
    for (let k = peak - 4; k <= peak + 4; k++) power += spectrum.psd[k] * spectrum.resolutionHz;
    expect(power).toBeCloseTo(2, 3);
  });

  it('chooses the resolution ζ_ref·f when the record allows eight segments, else coarser', () => {
    // f_s = 50 Hz, 2 Hz, ζ_ref = 0.005: Δf ≤ 0.01 Hz needs N = 8192 (Δf = 0.0061 Hz); 2 h of record gives 87 segments.
    expect(chooseSegmentLength(360_000, 50, 2)).toBe(8192);
    // 10 minutes hold only 6 segments of 8192 samples, so the segments are halved until eight fit.
    const n = 30_000;
    const length = chooseSegmentLength(n, 50, 2);
    expect(length).toBe(4096);
    expect(welchSegmentCount(n, length)).toBeGreaterThanOrEqual(8);
  });

  it('refuses a segment length that is not a power of two', () => {
    expect(() => welchPsd(new Float64Array(100), 10, 48)).toThrow(/segmentLength/);
  });
});
