/**
 * Floor walking: AISC Steel Design Guide 11, "Vibrations of Steel-Framed Structural Systems Due to Human Activity",
 * 2nd ed. (2016), chapter 4: a_p/g = P0 e^(−0.35 f_n) / (β W), P0 = 0.29 kN (floors) and 0.41 kN (footbridges),
 * f_n up to about 9 Hz — confirmed (engineering scripts and a damping table citing the guide). The step band
 * 1.6–2.2 Hz with four harmonics and the 3 Hz lower bound are NOT confirmed (from memory): the answer says so.
 * No worked example of the guide is cited here: the checks evaluate the formula by hand.
 */
import { describe, expect, it } from 'vitest';
import { dg11PeakAccelerationMPerS2 } from '../../shared/engine/loads/floor-walking';
import { assessDesign } from '../../shared/engine/design';

describe('DG11 walking criterion', () => {
  it('formula evaluated by hand', () => {
    // f_n = 5 Hz, β = 0.03, W = 500 kN: a/g = 290 e^(−1.75) / (0.03 × 500 000) = 0.0033596 (0.336 %g).
    const a = dg11PeakAccelerationMPerS2(290, 5, 0.03, 500_000);
    expect(a / 9.80665).toBeCloseTo((290 * 0.17377394345044514) / 15000, 10);
    expect(a / 9.80665).toBeCloseTo(0.0033596, 6);
  });

  it('the coupled-system route reproduces the formula for a bare floor (W = 2 g M, resonance of the harmonic force)', () => {
    // Invented floor bay: 6.3 Hz, β = 3 %, modal mass 21 t → W = 2 g M = 411.9 kN.
    const floor = { modalMassKg: 21000, frequencyHz: 6.3, dampingRatio: 0.03, direction: 'vertical' as const };
    const a = assessDesign({ structure: floor, tmds: [], loadCase: { kind: 'floor-walking' }, criteria: { set: 'dg11', class: 'office' } });
    const formula = dg11PeakAccelerationMPerS2(290, 6.3, 0.03, 2 * 9.80665 * 21000);
    expect(a.dg11?.formulaPeakAccelerationMPerS2).toBeCloseTo(formula, 12);
    // The envelope peaks slightly off f_n (the force falls with f, the response factor 1/√(1−ζ²)): within 1 %.
    expect(Math.abs(a.peakAccelerationMPerS2 / formula - 1)).toBeLessThan(0.01);
    expect(a.criterion?.limitMPerS2).toBeCloseTo(0.005 * 9.80665, 12);
    expect(a.verdict).toBe(a.peakAccelerationMPerS2 <= 0.005 * 9.80665 ? 'pass' : 'fail');
  });

  it('a damper on the floor mode lowers the DG11 response', () => {
    const floor = { modalMassKg: 21000, frequencyHz: 5.2, dampingRatio: 0.02, direction: 'vertical' as const };
    const bare = assessDesign({ structure: floor, tmds: [], loadCase: { kind: 'floor-walking' } });
    const damped = assessDesign({ structure: floor, tmds: [{ massKg: 630, frequencyHz: 5.05, dampingRatio: 0.1 }], loadCase: { kind: 'floor-walking' } });
    expect(damped.peakAccelerationMPerS2).toBeLessThan(0.5 * bare.peakAccelerationMPerS2);
  });

  it('names the step band, the harmonics and the 3 Hz bound as from memory in its answer', () => {
    const floor = { modalMassKg: 21000, frequencyHz: 6.3, dampingRatio: 0.03, direction: 'vertical' as const };
    const a = assessDesign({ structure: floor, tmds: [], loadCase: { kind: 'floor-walking' } });
    const note = a.warnings.find((w) => w.code === 'load-value-from-memory');
    expect(note?.message).toMatch(/1\.6–2\.2 Hz/);
    expect(note?.message).toMatch(/from memory/);
  });

  it('warns above the 9 Hz scope of the criterion', () => {
    const stiff = { modalMassKg: 15000, frequencyHz: 10.5, dampingRatio: 0.03, direction: 'vertical' as const };
    const a = assessDesign({ structure: stiff, tmds: [], loadCase: { kind: 'floor-walking' } });
    expect(a.warnings.map((w) => w.code)).toContain('structure-frequency-outside-load-model');
  });
});
