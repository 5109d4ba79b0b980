import { describe, expect, it } from 'vitest';
import { retuneDamper } from './retune';

describe('retuneDamper', () => {
  it('gives the Den Hartog damper frequency f_a = f_s / (1 + μ) for the measured structure', () => {
    // Den Hartog, Mechanical Vibrations, 4th ed. (1956): optimum frequency ratio 1/(1+μ) (from memory).
    const result = retuneDamper({ structureFrequencyHz: 2.1, structureDampingRatio: 0.006, massRatio: 0.02, method: 'den-hartog' });
    expect(result.targetFrequencyHz).toBeCloseTo(2.1 / 1.02, 12);
    expect(result.targetDampingRatio).toBeCloseTo(Math.sqrt((3 * 0.02) / (8 * 1.02)), 12);
    expect(result.currentFrequencyHz).toBeNull();
    expect(result.withinTuningRange).toBeNull();
  });

  it('gives the spring rate at the same mass (k′ = k (f′/f)²) and the mass at the same springs (m′ = m (f/f′)²)', () => {
    // Single-DOF oscillator f = √(k/m)/2π (any dynamics handbook, e.g. Chopra, Dynamics of Structures, ch. 2).
    const m = 800;
    const f = 2.0;
    const k = m * (2 * Math.PI * f) ** 2;
    const result = retuneDamper({ structureFrequencyHz: 2.2, structureDampingRatio: 0.005, massRatio: 0.02, method: 'den-hartog', tmdMassKg: m, springRateNPerM: k, tuningRangeRatio: 0.15 });
    const target = 2.2 / 1.02;
    expect(result.currentFrequencyHz).toBeCloseTo(f, 12);
    expect(result.springRateAtSameMassNPerM).toBeCloseTo(k * (target / f) ** 2, 6);
    expect(result.massAtSameSpringsKg).toBeCloseTo(m * (f / target) ** 2, 9);
    expect(result.frequencyChangeRatio).toBeCloseTo(target / f - 1, 12);
    expect(result.withinTuningRange).toBe(true);
    expect(retuneDamper({ structureFrequencyHz: 2.6, structureDampingRatio: 0.005, massRatio: 0.02, method: 'den-hartog', tmdMassKg: m, springRateNPerM: k, tuningRangeRatio: 0.15 }).withinTuningRange).toBe(false);
  });

  it('refuses a bad mass or range, naming the field', () => {
    expect(() => retuneDamper({ structureFrequencyHz: 2, structureDampingRatio: 0.005, massRatio: 0.02, method: 'den-hartog', tmdMassKg: -1 })).toThrow(/tmdMassKg/);
    expect(() => retuneDamper({ structureFrequencyHz: 2, structureDampingRatio: 0.005, massRatio: 0.02, method: 'den-hartog', tuningRangeRatio: 1.5 })).toThrow(/tuningRangeRatio/);
  });
});
