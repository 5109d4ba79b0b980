import { describe, expect, it } from 'vitest';
import { gradeComfort, iso10137BaseCurveRmsMPerS2, resolveComfortLimit } from './criteria';

describe('comfort criteria', () => {
  it('names set, class and limit for every choice', () => {
    const choices = [
      { peakAccelerationLimitMPerS2: 0.6 },
      { set: 'setra', class: 'mean' },
      { set: 'hivoss', class: 'CL2' },
      { set: 'en1990', class: 'crowd' },
      { set: 'dg11', class: 'office' },
      { set: 'iso10137', class: 'office' },
    ] as const;
    for (const c of choices) {
      const limit = resolveComfortLimit(c, 'vertical');
      expect(limit.label.length).toBeGreaterThan(5);
      expect(limit.source.length).toBeGreaterThan(5);
      expect(limit.limitMPerS2(2)).toBeGreaterThan(0);
    }
  });

  it('uses the horizontal limits for lateral and longitudinal modes', () => {
    // EN 1990:2002/A1:2005 Annex A2, A2.4.3.2: 0.7 m/s² vertical, 0.2 m/s² horizontal in normal use (the sources are
    // detailed in tests/reference/loads-criteria.test.ts).
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'lateral').limitMPerS2(1)).toBe(0.2);
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'longitudinal').limitMPerS2(1)).toBe(0.2);
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'vertical').limitMPerS2(1)).toBe(0.7);
  });

  it('refuses DG11 limits for a lateral mode', () => {
    expect(() => resolveComfortLimit({ set: 'dg11', class: 'office' }, 'lateral')).toThrow(/vertical modes only/);
  });

  it('the ISO base curve is continuous at its corners', () => {
    // ISO 10137 / ISO 2631-2 base curve: flat from 4 to 8 Hz vertical (seen), the parts outside from memory; a
    // piecewise curve without jumps at its corners is common practice.
    expect(iso10137BaseCurveRmsMPerS2(4 - 1e-9, 'vertical')).toBeCloseTo(iso10137BaseCurveRmsMPerS2(4, 'vertical'), 8);
    expect(iso10137BaseCurveRmsMPerS2(8 + 1e-9, 'vertical')).toBeCloseTo(iso10137BaseCurveRmsMPerS2(8, 'vertical'), 8);
    expect(iso10137BaseCurveRmsMPerS2(2 + 1e-9, 'horizontal')).toBeCloseTo(iso10137BaseCurveRmsMPerS2(2, 'horizontal'), 5);
  });

  it('grades comfort classes', () => {
    // HiVoSS 2008 CL1 < 0.5, CL2 0.5–1.0, CL4 > 2.5 m/s² vertical; Sétra 2006 lateral range 2 ("mean") 0.15–0.3,
    // beyond 0.8 m/s² unacceptable (both from memory, as in tests/reference/loads-criteria.test.ts).
    expect(gradeComfort('hivoss', 'vertical', 0.4)).toBe('CL1');
    expect(gradeComfort('hivoss', 'vertical', 0.9)).toBe('CL2');
    expect(gradeComfort('hivoss', 'vertical', 3)).toBe('CL4');
    expect(gradeComfort('setra', 'lateral', 0.2)).toBe('mean');
    expect(gradeComfort('setra', 'lateral', 0.9)).toBe('unacceptable');
  });
});

describe('torsional modes', () => {
  it('EN 1990 A2: the horizontal limits and the 2.5 Hz trigger', () => {
    // EN 1990 A2.4.3.2 asks for the check below 2.5 Hz for horizontal and torsional modes (details in
    // tests/reference/loads-torsional.test.ts).
    const normal = resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'torsional');
    expect(normal.limitMPerS2(2)).toBe(0.2);
    expect(normal.applicableRangeHz).toEqual([0, 2.5]);
    expect(normal.label).toMatch(/torsional/);
    expect(resolveComfortLimit({ set: 'en1990', class: 'crowd' }, 'torsional').limitMPerS2(2)).toBe(0.4);
  });

  it('the sets without a torsional limit refuse it and point to EN 1990 or a custom limit', () => {
    for (const c of [
      { set: 'setra', class: 'mean' },
      { set: 'hivoss', class: 'CL1' },
      { set: 'dg11', class: 'office' },
      { set: 'iso10137', class: 'office' },
    ] as const) {
      expect(() => resolveComfortLimit(c, 'torsional')).toThrow(/criteria\.set: .*(torsional|vertical modes only)/);
    }
    expect(() => resolveComfortLimit({ set: 'hivoss', class: 'CL1' }, 'torsional')).toThrow(/en1990/);
    expect(resolveComfortLimit({ peakAccelerationLimitMPerS2: 0.3 }, 'torsional').limitMPerS2(2)).toBe(0.3);
    expect(() => gradeComfort('hivoss', 'torsional', 0.2)).toThrow(RangeError);
  });
});

describe('limits from memory say so in the verdict', () => {
  it('Sétra lateral ranges, HiVoSS bands, ISO residential factor and horizontal curve', () => {
    expect(resolveComfortLimit({ set: 'setra', class: 'mean' }, 'lateral').caution).toMatch(/0\.15 \/ 0\.3 \/ 0\.8 .*from memory/);
    expect(resolveComfortLimit({ set: 'hivoss', class: 'CL2' }, 'vertical').caution).toMatch(/from memory/);
    expect(resolveComfortLimit({ set: 'iso10137', class: 'residential' }, 'vertical').caution).toMatch(/R = 4 .*from memory/);
    expect(resolveComfortLimit({ set: 'iso10137', class: 'office' }, 'lateral').caution).toMatch(/horizontal base curve .*from memory/);
  });

  it('confirmed limits carry no such caution', () => {
    // Sétra vertical ranges, EN 1990 A2, DG11, ISO office R = 8 on the vertical curve: confirmed (PRODUCT table).
    expect(resolveComfortLimit({ set: 'setra', class: 'mean' }, 'vertical').caution).not.toMatch(/ranges .*from memory/);
    for (const c of [{ set: 'en1990', class: 'crowd' }, { set: 'dg11', class: 'office' }, { set: 'iso10137', class: 'office' }] as const) {
      expect(resolveComfortLimit(c, 'vertical').caution).not.toMatch(/from memory/);
    }
    // An engineer's own response factor replaces the unconfirmed residential one.
    expect(resolveComfortLimit({ set: 'iso10137', class: 'residential', responseFactor: 4 }, 'vertical').caution).not.toMatch(/from memory/);
  });
});

describe('frequency ranges where the guides ask for a check', () => {
  it('Sétra reaches 5 Hz vertical (its range 3, second harmonic) and HiVoSS 4.6 Hz', () => {
    // Sétra 2006 range 3 is 2.6–5 Hz (confirmed); HiVoSS 2008 second-harmonic ψ ends at 4.6 Hz (confirmed).
    expect(resolveComfortLimit({ set: 'setra', class: 'mean' }, 'vertical').applicableRangeHz).toEqual([1.0, 5.0]);
    expect(resolveComfortLimit({ set: 'hivoss', class: 'CL2' }, 'vertical').applicableRangeHz).toEqual([1.25, 4.6]);
  });
});
