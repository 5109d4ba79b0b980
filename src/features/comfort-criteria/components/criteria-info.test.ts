import { describe, expect, it } from 'vitest';
import { describeCriteria } from './criteria-info';

describe('comfort criteria in plain words', () => {
  it('states the EN 1990 limits with their unit and source, as confirmed values', () => {
    // EN 1990 Annex A2, A2.4.3.2: 0.7 m/s² vertical, 0.2 m/s² horizontal in normal use (PRODUCT spec: confirmed).
    const lines = describeCriteria({ set: 'en1990', class: 'normal-use' });
    expect(lines[0].text).toMatch(/^Peak vertical acceleration at most 0\.7 m\/s² \(EN 1990 Annex A2/);
    expect(lines[1].text).toMatch(/horizontal acceleration at most 0\.2 m\/s²/);
    expect(lines.every((line) => !line.fromMemory)).toBe(true);
  });

  it('marks the values that are not confirmed as from memory', () => {
    // Sétra 2006: vertical 0.5 / 1.0 / 2.5 m/s² confirmed, lateral 0.15 / 0.3 / 0.8 m/s² not (PRODUCT spec).
    const setra = describeCriteria({ set: 'setra', class: 'mean' });
    expect(setra[0]).toMatchObject({ fromMemory: false });
    expect(setra[0].text).toContain('1 m/s²');
    expect(setra[1]).toMatchObject({ fromMemory: true });
    expect(setra[1].text).toContain('0.3 m/s²');
    // HiVoSS 2008: class names confirmed, bands not.
    expect(describeCriteria({ set: 'hivoss', class: 'CL2' }).every((line) => line.fromMemory)).toBe(true);
    // ISO 10137: office R = 8 confirmed, residential R = 4 not; the horizontal base curve not.
    expect(describeCriteria({ set: 'iso10137', class: 'office' }).map((line) => line.fromMemory)).toEqual([false, true]);
    expect(describeCriteria({ set: 'iso10137', class: 'residential' })[0].fromMemory).toBe(true);
  });

  it('gives the DG11 limit as a fraction of g and in m/s²', () => {
    // AISC DG11: a0/g = 0.5 % for offices (PRODUCT spec: confirmed); g = 9.80665 m/s² (standard gravity).
    expect(describeCriteria({ set: 'dg11', class: 'office' })[0].text).toContain('0.5 % of g = 0.049 m/s²');
  });

  it('gives the ISO 10137 plateau as √2 R × 0.005 m/s²', () => {
    // ISO 2631-2 base curve 0.005 m/s² r.m.s. on 4–8 Hz (PRODUCT spec: confirmed); office R = 8: √2 × 8 × 0.005 = 0.0566.
    expect(describeCriteria({ set: 'iso10137', class: 'office' })[0].text).toContain('0.0566 m/s²');
  });
});
