import { describe, expect, it } from 'vitest';
import {
  crowdModalForceN,
  crowdPsi,
  equivalentPedestrianCount,
  evaluatePsi,
  findCrowdHarmonicModel,
  findTrafficClass,
  forceDirectionOf,
  halfSineModeShapeMean,
  psiCurves,
  secondHarmonicPsiCurves,
} from './pedestrian-crowd';

describe('reduction coefficient ψ', () => {
  it('is continuous, within [0, 1] and trapezoidal for every guide and direction', () => {
    for (const guide of ['setra', 'hivoss'] as const) {
      for (const direction of ['vertical', 'lateral', 'longitudinal'] as const) {
        const c = psiCurves[guide][direction];
        let previous = evaluatePsi(c, 0);
        for (let f = 0; f <= 4; f += 0.001) {
          const v = crowdPsi(guide, direction, f);
          expect(v).toBeGreaterThanOrEqual(0);
          expect(v).toBeLessThanOrEqual(1);
          expect(Math.abs(v - previous)).toBeLessThan(0.01);
          previous = v;
        }
        expect(evaluatePsi(c, (c.oneFromHz + c.oneToHz) / 2)).toBe(1);
        expect(evaluatePsi(c, (c.zeroBelowHz + c.oneFromHz) / 2)).toBeCloseTo(0.5, 12);
      }
    }
  });

  it('keeps the two guides apart (their vertical curves differ)', () => {
    // Sétra 2006 vertical ψ 1.0 / 1.7 / 2.1 / 2.6 Hz, HiVoSS 2008 1.25 / 1.7 / 2.1 / 2.3 Hz (both confirmed): 1.2 and
    // 2.4 Hz lie inside the first and outside the second.
    expect(crowdPsi('setra', 'vertical', 1.2)).toBeGreaterThan(0);
    expect(crowdPsi('hivoss', 'vertical', 1.2)).toBe(0);
    expect(crowdPsi('setra', 'vertical', 2.4)).toBeGreaterThan(0);
    expect(crowdPsi('hivoss', 'vertical', 2.4)).toBe(0);
  });

  it('refuses a non-finite frequency', () => {
    expect(() => crowdPsi('setra', 'vertical', Number.NaN)).toThrow(RangeError);
  });
});

describe('equivalent number of pedestrians', () => {
  it('switches formula at 1 person/m²', () => {
    // Sétra 2006 / HiVoSS 2008: n' = 10.8 √(ζ n) below 1 P/m² (10.8 √(0.01 × 100) = 10.8), 1.85 √n from 1 P/m²
    // (1.85 √100 = 18.5).
    expect(equivalentPedestrianCount(100, 0.99, 0.01)).toBeCloseTo(10.8, 12);
    expect(equivalentPedestrianCount(100, 1.0, 0.01)).toBeCloseTo(18.5, 12);
  });
  it('refuses negative counts and damping ratios outside [0, 1)', () => {
    expect(() => equivalentPedestrianCount(-1, 0.5, 0.01)).toThrow(/pedestrianCount/);
    expect(() => equivalentPedestrianCount(10, 0.5, 1)).toThrow(/dampingRatio/);
  });
  it('builds the modal force P ψ n\' mean|φ|', () => {
    // P = 280 N vertical, 35 N lateral per person (Sétra 2006 / HiVoSS 2008, confirmed); ψ = 1 at 1.9 Hz (HiVoSS
    // vertical) and at 0.8 Hz (Sétra lateral); the mean of a unit half-sine is 2/π.
    expect(crowdModalForceN('hivoss', 'vertical', 10, halfSineModeShapeMean, 1.9)).toBeCloseTo((280 * 10 * 2) / Math.PI, 9);
    expect(crowdModalForceN('setra', 'lateral', 10, 1, 0.8)).toBeCloseTo(350, 12);
  });
  it('finds traffic classes by guide', () => {
    expect(findTrafficClass('hivoss', 'TC3')?.densityPerM2).toBe(0.5);
    expect(findTrafficClass('setra', 'TC3')).toBeUndefined();
  });
});

describe('second harmonic', () => {
  it('HiVoSS 2008: ψ rises from 0 at 2.5 Hz to its 0.25 plateau on 3.4–4.2 Hz and falls to 0 at 4.6 Hz (linear ramps)', () => {
    // Breakpoints confirmed (research code citing HiVoSS tables 4-6/4-7); straight lines between them are the figure's.
    expect(crowdPsi('hivoss', 'vertical', 2.5, 2)).toBe(0);
    expect(crowdPsi('hivoss', 'vertical', 2.95, 2)).toBeCloseTo(0.125, 12);
    expect(crowdPsi('hivoss', 'vertical', 3.4, 2)).toBe(0.25);
    expect(crowdPsi('hivoss', 'vertical', 4.2, 2)).toBe(0.25);
    expect(crowdPsi('hivoss', 'vertical', 4.4, 2)).toBeCloseTo(0.125, 12);
    expect(crowdPsi('hivoss', 'vertical', 4.6, 2)).toBe(0);
    // The first harmonic is untouched by the second: 0 between 2.3 and 2.5 Hz and above.
    expect(crowdPsi('hivoss', 'vertical', 3.8)).toBe(0);
  });

  it('is continuous and never above its plateau for every guide and direction', () => {
    for (const guide of ['setra', 'hivoss'] as const) {
      for (const direction of ['vertical', 'lateral', 'longitudinal'] as const) {
        const curve = secondHarmonicPsiCurves[guide][direction];
        if (!curve) continue;
        const top = curve.plateau ?? 1;
        let previous = evaluatePsi(curve, 0);
        for (let f = 0; f <= 6; f += 0.001) {
          const v = evaluatePsi(curve, f);
          expect(v).toBeGreaterThanOrEqual(0);
          expect(v).toBeLessThanOrEqual(top);
          expect(Math.abs(v - previous)).toBeLessThan(0.01);
          previous = v;
        }
      }
    }
  });

  it('per-person force: Sétra 2006 case 3 70 / 35 / 7 N; HiVoSS 2008 280 / 140 N times its ψ; no HiVoSS lateral', () => {
    expect(findCrowdHarmonicModel('setra', 2, 'vertical')?.forcePerPersonN).toBe(70);
    expect(findCrowdHarmonicModel('setra', 2, 'longitudinal')?.forcePerPersonN).toBe(35);
    expect(findCrowdHarmonicModel('setra', 2, 'lateral')?.forcePerPersonN).toBe(7);
    expect(findCrowdHarmonicModel('hivoss', 2, 'vertical')?.forcePerPersonN).toBe(280);
    expect(findCrowdHarmonicModel('hivoss', 2, 'lateral')).toBeUndefined();
    expect(crowdPsi('hivoss', 'lateral', 2, 2)).toBe(0);
    // On the plateau both guides load one person with 70 N vertically (HiVoSS 280 N × 0.25, Sétra 70 N × 1).
    expect(crowdModalForceN('hivoss', 'vertical', 1, 1, 3.8, 2)).toBe(70);
    expect(crowdModalForceN('setra', 'vertical', 1, 1, 3.8, 2)).toBe(70);
    expect(crowdModalForceN('hivoss', 'lateral', 1, 1, 2, 2)).toBe(0);
  });
});

describe('torsional modes', () => {
  it('take the vertical pedestrian force and ψ', () => {
    expect(forceDirectionOf('torsional')).toBe('vertical');
    expect(forceDirectionOf('lateral')).toBe('lateral');
    for (const f of [1.2, 1.9, 2.4]) {
      expect(crowdPsi('setra', 'torsional', f)).toBe(crowdPsi('setra', 'vertical', f));
      expect(crowdPsi('hivoss', 'torsional', f)).toBe(crowdPsi('hivoss', 'vertical', f));
    }
    expect(findCrowdHarmonicModel('hivoss', 1, 'torsional')?.forcePerPersonN).toBe(280);
    expect(psiCurves.setra.vertical).toBe(findCrowdHarmonicModel('setra', 1, 'torsional')?.psi);
  });
});
