import { describe, expect, it } from 'vitest';
import { buildHardwareEntry, damperCoefficientNsPerM, springRateNPerM, staticDeflectionM } from './hardware';

const tmd = { massKg: 1260, frequencyHz: 1.87, dampingRatio: 0.093 };

describe('hardware numbers', () => {
  it('k = m ω², c = 2 ζ m ω, δ = g / ω² = m g / k (PRODUCT conventions; g = 9.80665 m/s²)', () => {
    const w = 2 * Math.PI * tmd.frequencyHz;
    const k = springRateNPerM(tmd.massKg, tmd.frequencyHz);
    expect(k).toBeCloseTo(tmd.massKg * w * w, 9);
    expect(damperCoefficientNsPerM(tmd.massKg, tmd.frequencyHz, tmd.dampingRatio)).toBeCloseTo(2 * 0.093 * 1260 * w, 9);
    expect(staticDeflectionM(tmd.frequencyHz)).toBeCloseTo((tmd.massKg * 9.80665) / k, 12);
    // A 1 Hz oscillator sags g / (2π)² ≈ 248.4 mm (common practice check).
    expect(staticDeflectionM(1)).toBeCloseTo(0.24841, 5);
  });

  it('splits over units and springs, adds margin and the tuning range', () => {
    const h = buildHardwareEntry(tmd, 0.012, { unitCount: 3, springsPerUnit: 4, strokeMarginFactor: 1.5, strokeLimitM: 0.015, tuningRangeRatio: 0.1 });
    expect(h.perUnit.movingMassKg * 3).toBeCloseTo(tmd.massKg, 9);
    expect(h.perUnit.springRateNPerM * 3).toBeCloseTo(h.springRateNPerM, 6);
    expect(h.perUnit.springRatePerSpringNPerM * 12).toBeCloseTo(h.springRateNPerM, 6);
    expect(h.perUnit.damperCoefficientNsPerM * 3).toBeCloseTo(h.damperCoefficientNsPerM, 9);
    expect(h.designStrokeM).toBeCloseTo(0.018, 12);
    expect(h.strokeWithinLimit).toBe(false);
    expect(h.tuningRange.minFrequencyHz).toBeCloseTo(1.683, 9);
    expect(h.tuningRange.maxSpringRateNPerM / h.springRateNPerM).toBeCloseTo(1.21, 9);
    // Mass blocks: the frequency with the springs kept and the mass changed is f √(m / m').
    expect(tmd.frequencyHz * Math.sqrt(tmd.massKg / h.tuningRange.maxMovingMassKg)).toBeCloseTo(h.tuningRange.minFrequencyHz, 9);
    // Each unit keeps the frequency and damping ratio of the whole damper.
    const wUnit = Math.sqrt(h.perUnit.springRateNPerM / h.perUnit.movingMassKg);
    expect(wUnit / (2 * Math.PI)).toBeCloseTo(tmd.frequencyHz, 12);
    expect(h.perUnit.damperCoefficientNsPerM / (2 * h.perUnit.movingMassKg * wUnit)).toBeCloseTo(tmd.dampingRatio, 12);
  });

  it('refuses bad options by name', () => {
    expect(() => buildHardwareEntry(tmd, 0.01, { unitCount: 0 })).toThrow(/hardware.unitCount/);
    expect(() => buildHardwareEntry(tmd, 0.01, { strokeMarginFactor: 0.5 })).toThrow(/strokeMarginFactor/);
  });
});
