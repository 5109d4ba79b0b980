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
