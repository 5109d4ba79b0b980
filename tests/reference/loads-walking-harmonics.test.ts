/**
 * One walker / jogger: dynamic load factors of ONE set only, H. Bachmann & W. Ammann, "Vibrations in Structures
 * Induced by Man and Machines", IABSE Structural Engineering Documents 3e (1987).
 *  - walking, vertical α1 = 0.4, α2 = α3 = 0.1: confirmed (the values the Sétra 2006 guide quotes);
 *  - walking, lateral α½ = 0.039 (3.9 % of body weight at half the pacing frequency): confirmed — Bachmann &
 *    Ammann's value as tabulated in J. H. G. Macdonald, Proc. R. Soc. A 465 (2009), table 2, beside the 4 % of
 *    Dallard et al., "The London Millennium Footbridge", The Structural Engineer 79(22), 2001;
 *  - from memory (not confirmed): G = 800 N, the pacing bands 1.6–2.4 Hz (walking) and 2.0–3.5 Hz (running), the
 *    running factors α = 1.6, 0.7, 0.2.
 * DG11's factors (floor walking) are a separate set and never enter these cases.
 */
import { describe, expect, it } from 'vitest';
import { findGaitLoadModel } from '../../shared/engine/loads/walking-harmonics';
import { assessDesign } from '../../shared/engine/design';
import { sizeDamper } from '../../shared/engine/sizing';
import { mapRobustness } from '../../shared/engine/robustness';

describe('Bachmann & Ammann (1987) walking and running forces', () => {
  it('the factors of the set', () => {
    expect(findGaitLoadModel('walking', 'vertical')?.harmonics.map((h) => h.dynamicLoadFactor)).toEqual([0.4, 0.1, 0.1]);
    expect(findGaitLoadModel('jogging', 'vertical')?.harmonics.map((h) => h.dynamicLoadFactor)).toEqual([1.6, 0.7, 0.2]);
    // Lateral: 3.9 % of body weight (Bachmann & Ammann via Macdonald 2009, table 2), not 10 %.
    expect(findGaitLoadModel('walking', 'lateral')?.harmonics).toEqual([{ frequencyMultiple: 0.5, dynamicLoadFactor: 0.039 }]);
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

  it('walker on a lateral mode: α½ G / (2 ζ M) with α½ = 0.039, i.e. about 4 % of body weight', () => {
    // Bachmann & Ammann 3.9 % (Macdonald, Proc. R. Soc. A 465, 2009, table 2); Dallard et al. 2001 take 4 %.
    // Invented lateral mode at 0.95 Hz (half of a 1.9 Hz pace), M = 60 t, ζ = 0.7 %: 31.2 / 840 = 0.03714 m/s².
    const structure = { modalMassKg: 60000, frequencyHz: 0.95, dampingRatio: 0.007, direction: 'lateral' as const };
    const a = assessDesign({ structure, tmds: [], loadCase: { kind: 'walker' } });
    expect(a.modalForceAmplitudeN).toBeCloseTo(0.039 * 800, 12);
    const closed = (0.039 * 800) / (2 * 0.007 * 60000);
    expect(closed).toBeCloseTo(0.03714, 5);
    expect(a.peakAccelerationMPerS2 / closed).toBeCloseTo(1 / Math.sqrt(1 - 0.007 ** 2), 6);
    // Within 2.5 % of Dallard's 4 % of body weight.
    expect(Math.abs(a.modalForceAmplitudeN / (0.04 * 800) - 1)).toBeLessThan(0.026);
  });

  it('the answer names the values that are from memory (G = 800 N, the pacing band; the jogging factors)', () => {
    const structure = { modalMassKg: 18000, frequencyHz: 2.1, dampingRatio: 0.005, direction: 'vertical' as const };
    const walker = assessDesign({ structure, tmds: [], loadCase: { kind: 'walker' } });
    expect(walker.warnings.find((w) => w.code === 'load-value-from-memory')?.message).toMatch(/800 N/);
    const jogger = assessDesign({ structure, tmds: [], loadCase: { kind: 'jogger' } });
    expect(jogger.warnings.find((w) => w.code === 'load-value-from-memory')?.message).toMatch(/jogging load factors/);
  });

  it('size and robustness pass the from-memory note on with their answers', () => {
    // Invented floor-like span at 2.8 Hz under a jogger (factors 1.6 / 0.7 / 0.2 from memory).
    const structure = { modalMassKg: 40000, frequencyHz: 2.8, dampingRatio: 0.01, direction: 'vertical' as const };
    const sized = sizeDamper({ structure, method: 'den-hartog', loadCase: { kind: 'jogger' }, peakAccelerationLimitMPerS2: 1.0 });
    expect(sized.warnings.map((w) => w.code)).toContain('load-value-from-memory');
    const map = mapRobustness({
      structure, tmds: [{ massKg: 800, frequencyHz: 2.75, dampingRatio: 0.08 }], loadCase: { kind: 'jogger' },
      structureFrequencyFactors: [1], tmdDampingFactors: [1],
    });
    expect(map.warnings.map((w) => w.code)).toContain('load-value-from-memory');
  });

  it('jogger on a 5.4 Hz mode: the second harmonic (0.7 G) at 2.7 Hz pacing governs', () => {
    const structure = { modalMassKg: 18000, frequencyHz: 5.4, dampingRatio: 0.005, direction: 'vertical' as const };
    const a = assessDesign({ structure, tmds: [], loadCase: { kind: 'jogger' } });
    expect(a.modalForceAmplitudeN).toBeCloseTo(0.7 * 800, 9);
    expect(a.peakAccelerationMPerS2 / ((0.7 * 800) / (2 * 0.005 * 18000))).toBeCloseTo(1, 4);
  });
});
