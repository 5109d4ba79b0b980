/**
 * One walker / jogger: dynamic load factors of ONE set only, H. Bachmann & W. Ammann, "Vibrations in Structures
 * Induced by Man and Machines", IABSE Structural Engineering Documents 3e (1987): G = 800 N; walking (1.6–2.4 Hz)
 * α1 = 0.4, α2 = α3 = 0.1, lateral α1/2 = 0.1; running (2.0–3.5 Hz) α1 = 1.6, α2 = 0.7, α3 = 0.2 — all from memory.
 * DG11's factors (floor walking) are a separate set and never enter these cases.
 */
import { describe, expect, it } from 'vitest';
import { findGaitLoadModel } from '../../shared/engine/loads/walking-harmonics';
import { assessDesign } from '../../shared/engine/design';

describe('Bachmann & Ammann (1987) walking and running forces', () => {
  it('the factors of the set', () => {
    expect(findGaitLoadModel('walking', 'vertical')?.harmonics.map((h) => h.dynamicLoadFactor)).toEqual([0.4, 0.1, 0.1]);
    expect(findGaitLoadModel('jogging', 'vertical')?.harmonics.map((h) => h.dynamicLoadFactor)).toEqual([1.6, 0.7, 0.2]);
    expect(findGaitLoadModel('walking', 'lateral')?.harmonics).toEqual([{ frequencyMultiple: 0.5, dynamicLoadFactor: 0.1 }]);
    expect(findGaitLoadModel('walking', 'vertical')?.pacingRangeHz).toEqual([1.6, 2.4]);
    expect(findGaitLoadModel('jogging', 'vertical')?.pacingRangeHz).toEqual([2.0, 3.5]);
    expect(findGaitLoadModel('jogging', 'lateral')).toBeUndefined();
  });

  it('walker at resonance: α1 G / (2 ζ M) (steady state, closed form)', () => {
    const structure = { modalMassKg: 18000, frequencyHz: 2.1, dampingRatio: 0.005, direction: 'vertical' as const };
    const a = assessDesign({ structure, tmds: [], loadCase: { kind: 'walker' } });
    expect(a.peakAccelerationMPerS2 / ((0.4 * 800) / (2 * 0.005 * 18000))).toBeCloseTo(1 / Math.sqrt(1 - 0.005 ** 2), 6);
    expect(a.modalForceAmplitudeN).toBe(320);
  });

  it('jogger on a 5.4 Hz mode: the second harmonic (0.7 G) at 2.7 Hz pacing governs', () => {
    const structure = { modalMassKg: 18000, frequencyHz: 5.4, dampingRatio: 0.005, direction: 'vertical' as const };
    const a = assessDesign({ structure, tmds: [], loadCase: { kind: 'jogger' } });
    expect(a.modalForceAmplitudeN).toBeCloseTo(0.7 * 800, 9);
    expect(a.peakAccelerationMPerS2 / ((0.7 * 800) / (2 * 0.005 * 18000))).toBeCloseTo(1, 4);
  });
});
