import { describe, expect, it } from 'vitest';
import { findHalfPower, findSpectrumPeak, fitSingleMode, hannLineKernel, singleModeShape } from './fit-spectrum';
import { welchPsd } from './welch';
import { ambientRecord, seededNormal } from './test-records';

describe('single-mode spectrum fit', () => {
  it('the Hann line kernel is symmetric, sums to 1, and holds about 99.9 % of its weight within ±2 lines (its main lobe)', () => {
    const { offsetsLines, weights } = hannLineKernel();
    expect(weights.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    let inside = 0;
    for (let j = 0; j < weights.length; j++) {
      expect(weights[j]).toBeCloseTo(weights[weights.length - 1 - j], 14);
      if (Math.abs(offsetsLines[j]) <= 2) inside += weights[j];
    }
    expect(inside).toBeGreaterThan(0.999);
  });

  it('the shape peaks near f_n with the height H and falls to half at f_n(1 ± ζ) (light damping)', () => {
    const fn = 2;
    const zeta = 0.01;
    expect(singleModeShape(fn, fn, zeta, 5, 0)).toBeCloseTo(5, 12);
    // |H|² of one mode falls to half its peak at r² = 1 ∓ 2ζ to O(ζ²) (Chopra, ch. 3, from memory).
    expect(singleModeShape(fn * (1 + zeta), fn, zeta, 1, 0)).toBeCloseTo(0.5, 1);
    expect(singleModeShape(fn * (1 - zeta), fn, zeta, 1, 0)).toBeCloseTo(0.5, 1);
  });

  it('recovers f and ζ from a long random response whatever the resolution (1 to 8 lines per half-power bandwidth), where the half-power width is biased', () => {
    // A white-noise-driven oscillator integrated exactly; 22 h of record so that the scatter is small next to the bias checked.
    const oscillator = { frequencyHz: 2, dampingRatio: 0.01, sampleRateHz: 20 };
    const record = ambientRecord(oscillator, 80_000, 7);
    const band = [0.5, 9] as const;
    const halfPowerRatios: number[] = [];
    for (const segment of [512, 1024, 2048, 4096]) {
      const spectrum = welchPsd(record, oscillator.sampleRateHz, segment);
      const search = findSpectrumPeak(spectrum.frequencyHz, spectrum.psd, band);
      expect(search.found).toBe(true);
      if (!search.found) return;
      const fit = fitSingleMode(spectrum.frequencyHz, spectrum.psd, search.peak, band, 0.02)!;
      expect(Math.abs(fit.naturalFrequencyHz / 2 - 1)).toBeLessThan(1e-3);
      expect(Math.abs(fit.dampingRatio / 0.01 - 1)).toBeLessThan(0.03);
      expect(fit.atBound).toBe(false);
      halfPowerRatios.push(findHalfPower(spectrum.frequencyHz, spectrum.psd, search.peak, band)!.dampingRatio / 0.01);
    }
    // The half-power width at one line per bandwidth is about twice the truth: why it is only a cross-check.
    expect(halfPowerRatios[0]).toBeGreaterThan(1.5);
    expect(Math.abs(halfPowerRatios[3] - 1)).toBeLessThan(0.1);
  }, 30_000);

  it('finds no clear peak in white noise, and none at the edge of a band', () => {
    const normal = seededNormal(5);
    const noise = Float64Array.from({ length: 50_000 }, () => normal());
    const spectrum = welchPsd(noise, 50, 1024);
    const search = findSpectrumPeak(spectrum.frequencyHz, spectrum.psd, [0.5, 20]);
    expect(search.found).toBe(false);
    if (!search.found) expect(search.reason).toMatch(/no clear peak/);
    const record = ambientRecord({ frequencyHz: 2, dampingRatio: 0.01, sampleRateHz: 50 }, 1000, 1);
    const lowPart = welchPsd(record, 50, 2048);
    const edge = findSpectrumPeak(lowPart.frequencyHz, lowPart.psd, [1, 1.8]);
    expect(edge.found).toBe(false);
    if (!edge.found) expect(edge.reason).toMatch(/edge of the band/);
  });
});
