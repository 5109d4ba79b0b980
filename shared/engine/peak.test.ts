import { describe, expect, it } from 'vitest';
import { maximiseOnInterval } from './peak';

describe('maximiseOnInterval', () => {
  it('finds a smooth interior maximum far better than the grid spacing', () => {
    const fn = (x: number) => 1 / (1 + ((x - 2.3456789) / 0.01) ** 2);
    const result = maximiseOnInterval(fn, 1, 4, { samples: 16, hints: [2.35] });
    expect(result.x).toBeCloseTo(2.3456789, 6);
    expect(result.value).toBeCloseTo(1, 10);
  });

  it('returns an endpoint maximum exactly', () => {
    expect(maximiseOnInterval((x) => Math.exp(-x), 0.5, 3)).toEqual({ x: 0.5, value: Math.exp(-0.5) });
    expect(maximiseOnInterval((x) => x * x, -1, 2)).toEqual({ x: 2, value: 4 });
  });

  it('finds the apex of a kink and ignores flat zero parts', () => {
    // A trapezoid weight (0 below 1.25, rising to 1 at 1.7, 1 to 2.1, 0 from 2.3) times a falling curve: the apex is
    // at the kink 1.7.
    const weight = (f: number) => (f <= 1.25 || f >= 2.3 ? 0 : f < 1.7 ? (f - 1.25) / 0.45 : f <= 2.1 ? 1 : (2.3 - f) / 0.2);
    const result = maximiseOnInterval((f) => weight(f) / f, 0.5, 3, { samples: 24 });
    expect(result.x).toBeCloseTo(1.7, 6);
    expect(result.value).toBeCloseTo(1 / 1.7, 7);
    expect(maximiseOnInterval(() => 0, 1, 2).value).toBe(0);
  });

  it('picks the higher of two close peaks', () => {
    const peak = (x: number, c: number, h: number) => h / (1 + ((x - c) / 0.02) ** 2);
    const result = maximiseOnInterval((x) => peak(x, 0.95, 1) + peak(x, 1.05, 1.001), 0.5, 2);
    expect(result.x).toBeCloseTo(1.05, 2);
    expect(result.value).toBeGreaterThan(1.001);
  });

  it('refuses a reversed interval and a non-finite value', () => {
    expect(() => maximiseOnInterval((x) => x, 2, 1)).toThrow(/hi < lo/);
    expect(() => maximiseOnInterval(() => Number.NaN, 1, 2)).toThrow(/returned NaN/);
  });
});
