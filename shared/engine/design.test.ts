import { describe, expect, it } from 'vitest';
import { assessDesign } from './design';
import { createModeTmdSystem, findResponsePeak } from './response';

// Invented footbridge mode and damper.
const structure = { modalMassKg: 52000, frequencyHz: 1.9, dampingRatio: 0.005, direction: 'vertical' as const };
const tmd = { massKg: 1040, frequencyHz: 1.862, dampingRatio: 0.085 };
const crowd = { kind: 'crowd' as const, guide: 'hivoss' as const, densityPerM2: 0.5, deckAreaM2: 240 };

describe('assess', () => {
  it('agrees with the engine’s own peak search (findResponsePeak with the same force weight)', () => {
    const a = assessDesign({ structure, tmds: [tmd], loadCase: crowd });
    const nEq = 10.8 * Math.sqrt(0.005 * 120);
    const psi = (f: number) => (f <= 1.25 || f >= 2.3 ? 0 : f < 1.7 ? (f - 1.25) / 0.45 : f <= 2.1 ? 1 : (2.3 - f) / 0.2);
    const weight = (f: number) => 280 * psi(f) * nEq * (2 / Math.PI);
    const system = createModeTmdSystem(structure, [tmd]);
    const engine = findResponsePeak(system, [1.25, 2.3], { forceWeight: weight });
    expect(a.peakAccelerationMPerS2 / engine.value - 1).toBeLessThan(1e-5);
    expect(a.peakAccelerationMPerS2 / engine.value - 1).toBeGreaterThan(-1e-5);
    const stroke = findResponsePeak(system, [1.25, 2.3], { forceWeight: weight, quantity: 'tmdStroke' });
    expect(a.tmdStrokeM[0] / stroke.value).toBeCloseTo(1, 5);
    expect(a.equivalentPedestrians).toBeCloseTo(nEq, 12);
    expect(a.modalForceAmplitudeN).toBeCloseTo(weight(a.atFrequencyHz), 9);
    expect(a.bareStructurePeakAccelerationMPerS2).toBeGreaterThan(4 * a.peakAccelerationMPerS2);
  });

  it('states verdict, utilisation and the limit it used', () => {
    const a = assessDesign({ structure, tmds: [tmd], loadCase: crowd, criteria: { set: 'hivoss', class: 'CL1' } });
    expect(a.criterion?.set).toBe('hivoss');
    expect(a.criterion?.limitMPerS2).toBe(0.5);
    expect(a.utilisation).toBeCloseTo(a.peakAccelerationMPerS2 / 0.5, 12);
    expect(a.verdict).toBe(a.peakAccelerationMPerS2 <= 0.5 ? 'pass' : 'fail');
    expect(a.bareStructureVerdict).toBe('fail');
  });

  it('uses the frequency-dependent ISO 10137 limit at its governing frequency', () => {
    const floor = { modalMassKg: 24000, frequencyHz: 6.1, dampingRatio: 0.03, direction: 'vertical' as const };
    const a = assessDesign({ structure: floor, tmds: [], loadCase: { kind: 'floor-walking' }, criteria: { set: 'iso10137', class: 'office' } });
    // 6.1 Hz lies on the flat part of the base curve: limit √2 × 8 × 0.005.
    expect(a.criterion?.limitMPerS2).toBeCloseTo(Math.SQRT2 * 8 * 0.005, 9);
    expect(a.utilisation).toBeGreaterThanOrEqual(a.peakAccelerationMPerS2 / (Math.SQRT2 * 8 * 0.005) - 1e-9);
  });

  it('warns: stroke beyond travel, mass ratio outside 0.5–10 %, frequency outside the load model', () => {
    const a = assessDesign({
      structure: { ...structure, frequencyHz: 2.6 },
      tmds: [{ massKg: 52000 * 0.003, frequencyHz: 2.58, dampingRatio: 0.03 }],
      loadCase: crowd,
      hardware: { strokeLimitM: 1e-5 },
    });
    const codes = a.warnings.map((w) => w.code);
    expect(codes).toContain('stroke-beyond-travel');
    expect(codes).toContain('mass-ratio-outside-range');
    expect(codes).toContain('structure-frequency-outside-load-model');
  });

  it('harmonic load on the bare mode: peak acceleration F/(2ζ M √(1−ζ²)) at f_s/√(1−2ζ²) (closed form)', () => {
    const a = assessDesign({ structure, tmds: [], loadCase: { kind: 'harmonic', modalForceAmplitudeN: 500, pacingRangeHz: [1.5, 2.5] } });
    const z = structure.dampingRatio;
    expect(a.peakAccelerationMPerS2).toBeCloseTo(500 / (2 * z * structure.modalMassKg * Math.sqrt(1 - z * z)), 6);
    expect(a.atFrequencyHz).toBeCloseTo(structure.frequencyHz / Math.sqrt(1 - 2 * z * z), 4);
  });

  it('lateral crowd: lock-in check against the expected number on the deck', () => {
    const lateral = { modalMassKg: 98000, frequencyHz: 0.88, dampingRatio: 0.007, direction: 'lateral' as const };
    const a = assessDesign({ structure: lateral, tmds: [], loadCase: { kind: 'lateral', guide: 'setra', densityPerM2: 0.8, deckAreaM2: 400 } });
    expect(a.lockIn?.bareStructureCriticalPedestrians).toBeCloseTo((8 * Math.PI * 0.007 * 0.88 * 98000) / 300, 9);
    expect(a.lockIn?.expectedPedestrians).toBeCloseTo(320, 9);
    expect(a.lockIn?.lockInExpected).toBe(320 >= (a.lockIn?.criticalPedestrians ?? 0));
  });
});
