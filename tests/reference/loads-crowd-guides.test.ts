/**
 * Crowd load models of the Sétra (2006) and HiVoSS (2008) footbridge guides (first harmonic; the second is in
 * loads-second-harmonic.test.ts).
 *  - Sétra/AFGC, "Footbridges: assessment of vibrational behaviour of footbridges under pedestrian loading",
 *    technical guide, October 2006 — traffic classes III (0.5 P/m²), II (0.8 P/m²) and I (1.0 P/m²),
 *    n' = 10.8 √(ξ n) (classes III, II) and 1.85 √n (class I), the first-harmonic ψ breakpoints 1.0 / 1.7 / 2.1 /
 *    2.6 Hz vertical and 0.3 / 0.5 / 1.1 / 1.3 Hz lateral: confirmed (a reproduction of the guide's tables); the
 *    linear ramps between the breakpoints are read from the guide's figure.
 *  - HiVoSS, "Design of footbridges — Guideline" (RFS2-CT-2007-00033, 2008) — TC1 (15 persons on the deck),
 *    TC2–TC5 (0.2 / 0.5 / 1.0 / 1.5 P/m²), ψ breakpoints 1.25 / 1.7 / 2.1 / 2.3 Hz vertical and 0.5 / 0.7 / 1.0 /
 *    1.2 Hz lateral: confirmed (research code citing the guide's tables 4-6 and 4-7).
 *  - Per-person first-harmonic amplitudes 280 N vertical, 140 N longitudinal, 35 N lateral: confirmed (both).
 *  - The use of the vertical ψ for longitudinal modes (both guides): from memory.
 * The expected numbers below are evaluated by hand from those published formulas.
 */
import { describe, expect, it } from 'vitest';
import { crowdPsi, equivalentPedestrianCount, findTrafficClass, pedestrianForceAmplitudeN } from '../../shared/engine/loads/pedestrian-crowd';
import { assessDesign } from '../../shared/engine/design';

type PsiPoint = readonly [frequencyHz: number, psi: number];

/** ψ at each point: the breakpoint values 0 and 1 exactly, the midpoints of a slope to 1e-12. */
function expectPsi(guide: 'setra' | 'hivoss', direction: 'vertical' | 'lateral' | 'longitudinal', points: readonly PsiPoint[]): void {
  for (const [frequencyHz, psi] of points) {
    if (psi === 0 || psi === 1) expect(crowdPsi(guide, direction, frequencyHz)).toBe(psi);
    else expect(crowdPsi(guide, direction, frequencyHz)).toBeCloseTo(psi, 12);
  }
}

describe('Sétra 2006 ψ (first harmonic)', () => {
  it('vertical: 0 up to 1.0 Hz, rising to 1 at 1.7 Hz, 1 to 2.1 Hz, 0 from 2.6 Hz', () => {
    expectPsi('setra', 'vertical', [[0.9, 0], [1.0, 0], [1.35, 0.5], [1.7, 1], [2.1, 1], [2.35, 0.5], [2.6, 0]]);
  });
  it('lateral: 0 up to 0.3 Hz, 1 from 0.5 to 1.1 Hz, 0 from 1.3 Hz', () => {
    expectPsi('setra', 'lateral', [[0.3, 0], [0.4, 0.5], [0.5, 1], [1.1, 1], [1.2, 0.5], [1.3, 0]]);
  });
});

describe('HiVoSS 2008 ψ', () => {
  it('vertical: 1.25 / 1.7 / 2.1 / 2.3 Hz', () => {
    expectPsi('hivoss', 'vertical', [[1.25, 0], [1.475, 0.5], [1.9, 1], [2.2, 0.5], [2.3, 0]]);
    expectPsi('hivoss', 'longitudinal', [[2.2, 0.5]]);
  });
  it('lateral: 0.5 / 0.7 / 1.0 / 1.2 Hz', () => {
    expectPsi('hivoss', 'lateral', [[0.6, 0.5], [0.85, 1], [1.1, 0.5]]);
  });
});

describe('density classes and n\'', () => {
  it('class densities', () => {
    expect(findTrafficClass('setra', 'III')?.densityPerM2).toBe(0.5);
    expect(findTrafficClass('setra', 'II')?.densityPerM2).toBe(0.8);
    expect(findTrafficClass('setra', 'I')?.densityPerM2).toBe(1.0);
    expect(findTrafficClass('hivoss', 'TC1')?.personCount).toBe(15);
    expect([2, 3, 4, 5].map((i) => findTrafficClass('hivoss', `TC${i}`)?.densityPerM2)).toEqual([0.2, 0.5, 1.0, 1.5]);
  });
  it('n\' = 10.8 √(ζ n) below 1 P/m² and 1.85 √n from 1 P/m² (hand-evaluated)', () => {
    // 0.8 P/m² on 250 m²: n = 200, ζ = 0.5 %: 10.8 √1 = 10.8.
    expect(equivalentPedestrianCount(200, 0.8, 0.005)).toBeCloseTo(10.8, 12);
    // 1.0 P/m² on 400 m²: n = 400: 1.85 × 20 = 37.
    expect(equivalentPedestrianCount(400, 1.0, 0.005)).toBeCloseTo(37, 12);
  });
  it('per-person amplitudes', () => {
    expect(pedestrianForceAmplitudeN).toEqual({ vertical: 280, longitudinal: 140, lateral: 35 });
  });
});

describe('closed-form resonance of a simply supported span under a crowd', () => {
  // peak = P n' (2/π) / (2 ζ M) with ψ = 1 at f_s (steady resonance of a single-DOF mode: a = F / (2 ζ M)).
  // Invented span: 1.9 Hz (ψ = 1 for both guides), M = 60 t, ζ = 0.6 %.
  const structure = { modalMassKg: 60000, frequencyHz: 1.9, dampingRatio: 0.006, direction: 'vertical' as const };
  for (const guide of ['setra', 'hivoss'] as const) {
    it(`${guide}: 0.5 P/m² on 300 m²`, () => {
      const a = assessDesign({ structure, tmds: [], loadCase: { kind: 'crowd', guide, densityPerM2: 0.5, deckAreaM2: 300 } });
      const nEq = 10.8 * Math.sqrt(0.006 * 150);
      const closed = (280 * nEq * (2 / Math.PI)) / (2 * 0.006 * 60000);
      // The continuous maximum of |a(f)| sits a hair above f_s (factor 1/√(1−ζ²) for acceleration).
      expect(a.peakAccelerationMPerS2 / closed).toBeCloseTo(1 / Math.sqrt(1 - 0.006 ** 2), 6);
      expect(a.equivalentPedestrians).toBeCloseTo(nEq, 12);
      expect(a.modalForceAmplitudeN).toBeCloseTo(280 * nEq * (2 / Math.PI), 6);
      expect(a.atFrequencyHz).toBeCloseTo(1.9, 3);
    });
  }
  it('lateral mode: 35 N per person', () => {
    const lateral = { modalMassKg: 80000, frequencyHz: 0.8, dampingRatio: 0.008, direction: 'lateral' as const };
    const a = assessDesign({ structure: lateral, tmds: [], loadCase: { kind: 'crowd', guide: 'setra', densityPerM2: 1.0, deckAreaM2: 324 } });
    const closed = (35 * 1.85 * 18 * (2 / Math.PI)) / (2 * 0.008 * 80000);
    expect(a.peakAccelerationMPerS2 / closed).toBeCloseTo(1, 4);
  });
});
