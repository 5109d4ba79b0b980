/**
 * US customary values of the as-built comparison, checked against the conversion factors of NIST Special
 * Publication 811 (2008), appendix B.8 — written here from the publication, not from src/lib/units.ts:
 *   pound (avoirdupois) (lb) → kilogram (kg):             4.535 924 E−01 (exactly 0.45359237)
 *   pound-force per inch (lbf/in) → newton per metre (N/m): 1.751 268 E+02
 * (the lbf/in factor is quoted from memory of that table; it also follows from the exact definitions
 * 1 lbf = 0.45359237 kg × 9.80665 m/s² and 1 in = 0.0254 m, checked below).
 * The measured values are invented.
 */
import { describe, expect, it } from 'vitest';
import { usCustomaryDeviation, usCustomaryRange, usCustomaryText } from './as-built-units';

const kgPerLbNist = 0.45359237;
const nPerMPerLbfPerInNist = 175.1268;

describe('as-built values in US customary units', () => {
  it('a moving mass in pounds (NIST SP 811: 1 lb = 0.45359237 kg exactly)', () => {
    // 250 kg / 0.45359237 kg/lb = 551.1557 lb
    expect(250 / kgPerLbNist).toBeCloseTo(551.1557, 4);
    expect(usCustomaryText('mass', 250)).toBe('551.2 lb');
    expect(usCustomaryText('mass', 1234.5, 5)).toBe(`${new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 5 }).format(1234.5 / kgPerLbNist)} lb`);
  });

  it('a spring rate in lbf/in (NIST SP 811: 1 lbf/in = 175.1268 N/m)', () => {
    // The table's factor agrees with the exact definitions to its seven figures.
    expect((kgPerLbNist * 9.80665) / 0.0254).toBeCloseTo(nPerMPerLbfPerInNist, 3);
    // 39 000 N/m / 175.1268 = 222.70 lbf/in
    expect(usCustomaryText('stiffness', 39_000)).toBe('222.7 lbf/in');
    expect(Number(usCustomaryText('stiffness', 39_000, 7).split(' ')[0].replace(/,/g, ''))).toBeCloseTo(39_000 / nPerMPerLbfPerInNist, 3);
  });

  it('a deviation keeps its sign and a range both ends', () => {
    expect(usCustomaryDeviation('mass', 12.5)).toBe(`+${(12.5 / kgPerLbNist).toPrecision(3)} lb`); // +27.6 lb
    expect(usCustomaryDeviation('mass', -12.5)).toBe(`−${(12.5 / kgPerLbNist).toPrecision(3)} lb`);
    expect(usCustomaryDeviation('mass', 0)).toBe('0 lb');
    expect(usCustomaryRange('stiffness', 35_000, 43_000)).toBe('200–246 lbf/in'); // 199.86 and 245.54 lbf/in
  });
});
