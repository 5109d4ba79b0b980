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
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'lateral').limitMPerS2(1)).toBe(0.2);
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'longitudinal').limitMPerS2(1)).toBe(0.2);
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'vertical').limitMPerS2(1)).toBe(0.7);
  });

  it('refuses DG11 limits for a lateral mode', () => {
    expect(() => resolveComfortLimit({ set: 'dg11', class: 'office' }, 'lateral')).toThrow(/vertical modes only/);
  });

  it('the ISO base curve is continuous at its corners', () => {
    expect(iso10137BaseCurveRmsMPerS2(4 - 1e-9, 'vertical')).toBeCloseTo(iso10137BaseCurveRmsMPerS2(4, 'vertical'), 8);
    expect(iso10137BaseCurveRmsMPerS2(8 + 1e-9, 'vertical')).toBeCloseTo(iso10137BaseCurveRmsMPerS2(8, 'vertical'), 8);
    expect(iso10137BaseCurveRmsMPerS2(2 + 1e-9, 'horizontal')).toBeCloseTo(iso10137BaseCurveRmsMPerS2(2, 'horizontal'), 5);
  });

  it('grades comfort classes', () => {
    expect(gradeComfort('hivoss', 'vertical', 0.4)).toBe('CL1');
    expect(gradeComfort('hivoss', 'vertical', 0.9)).toBe('CL2');
    expect(gradeComfort('hivoss', 'vertical', 3)).toBe('CL4');
    expect(gradeComfort('setra', 'lateral', 0.2)).toBe('mean');
    expect(gradeComfort('setra', 'lateral', 0.9)).toBe('unacceptable');
  });
});
