import { describe, expect, it } from 'vitest';
import { usCustomaryValue } from './hardware-sheet-units';

// Exact factors of NIST Special Publication 811 (2008), appendix B: 1 lb = 0.45359237 kg, 1 in = 0.0254 m,
// 1 lbf = 4.4482216152605 N.
describe('the hardware sheet in US customary units beside SI', () => {
  it('converts the sheet rows by their unit (lengths are given in mm)', () => {
    expect(usCustomaryValue(25.4, 'mm')).toBe('1 in');
    expect(usCustomaryValue(45.359237, 'kg')).toBe('100 lb');
    // 1 lbf/in = 4.4482216152605 N / 0.0254 m = 175.126835… N/m
    expect(usCustomaryValue(175126.835, 'N/m')).toBe('1,000 lbf/in');
    expect(usCustomaryValue(1751.26835, 'N·s/m')).toBe('10 lbf·s/in');
  });

  it('keeps four significant figures or more', () => {
    expect(usCustomaryValue(300, 'kg')).toBe('661.4 lb'); // 300 / 0.45359237 = 661.387…
    expect(usCustomaryValue(300, 'kg', 6)).toBe('661.387 lb');
  });

  it('gives none for frequencies, ratios, counts and texts', () => {
    expect(usCustomaryValue(1.95, 'Hz')).toBeNull();
    expect(usCustomaryValue(0.02, '')).toBeNull();
    expect(usCustomaryValue('not given', 'mm')).toBeNull();
  });
});
