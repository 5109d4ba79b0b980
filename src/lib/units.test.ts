import { describe, expect, it } from 'vitest';
import { formatInUnits, fromDisplay, KG_PER_LB, M_PER_FT, M_PER_IN, N_PER_LBF, STANDARD_GRAVITY_M_PER_S2, toDisplay, unitLabel, type Quantity } from './units';

// Every definition below is NIST Special Publication 811 (2008), appendix B: the pound, inch and foot are exact by
// definition (international yard and pound agreement of 1959), standard gravity is exact (3rd CGPM, 1901), and the
// pound-force is the pound under standard gravity, 4.448 221 615 260 5 N exactly.
describe('display units against NIST SP 811', () => {
  it('uses the exact definitions', () => {
    expect(KG_PER_LB).toBe(0.45359237);
    expect(M_PER_IN).toBe(0.0254);
    expect(M_PER_FT).toBe(0.3048);
    expect(STANDARD_GRAVITY_M_PER_S2).toBe(9.80665);
    expect(N_PER_LBF).toBeCloseTo(4.4482216152605, 13);
    expect(M_PER_FT / M_PER_IN).toBeCloseTo(12, 14);
  });

  it('converts one pound, one inch, one foot and one pound-force to their SI values', () => {
    expect(fromDisplay('mass', 1, 'us-customary')).toBeCloseTo(0.45359237, 15);
    expect(fromDisplay('displacement', 1, 'us-customary')).toBeCloseTo(0.0254, 15);
    expect(fromDisplay('length', 1, 'us-customary')).toBeCloseTo(0.3048, 15);
    expect(fromDisplay('force', 1, 'us-customary')).toBeCloseTo(4.4482216152605, 12);
    // 1 ft² = 0.09290304 m² exactly (NIST SP 811, B.8).
    expect(fromDisplay('area', 1, 'us-customary')).toBeCloseTo(0.09290304, 15);
  });

  it('gives 1 g as 100 %g and 1 kg as 2.20462262… lb (NIST SP 811, B.8: 1 kg = 2.204 623 lb)', () => {
    expect(toDisplay('acceleration', 9.80665, 'us-customary')).toBeCloseTo(100, 12);
    expect(toDisplay('mass', 1, 'us-customary')).toBeCloseTo(2.2046226218, 9);
  });

  it('gives 1 lbf/in as 175.126835… N/m (NIST SP 811, B.8: 1 lbf/in = 175.1268 N/m)', () => {
    expect(fromDisplay('stiffness', 1, 'us-customary')).toBeCloseTo(4.4482216152605 / 0.0254, 9);
    expect(fromDisplay('stiffness', 1, 'us-customary')).toBeCloseTo(175.1268, 4);
    expect(fromDisplay('damping', 1, 'us-customary')).toBeCloseTo(175.1268, 4);
  });

  it('leaves SI values as they are (strokes shown in mm) and frequency untouched in both systems', () => {
    expect(toDisplay('mass', 1234.5, 'si')).toBe(1234.5);
    expect(toDisplay('displacement', 0.0125, 'si')).toBeCloseTo(12.5, 12);
    expect(toDisplay('frequency', 1.87, 'us-customary')).toBe(1.87);
    expect(unitLabel('acceleration', 'us-customary')).toBe('%g');
    expect(unitLabel('stiffness', 'si')).toBe('N/m');
  });

  it('round-trips every quantity', () => {
    const quantities: Quantity[] = ['mass', 'force', 'length', 'displacement', 'area', 'stiffness', 'damping', 'acceleration', 'frequency'];
    for (const quantity of quantities) {
      for (const system of ['si', 'us-customary'] as const) {
        expect(fromDisplay(quantity, toDisplay(quantity, 3.14159, system), system)).toBeCloseTo(3.14159, 12);
      }
    }
  });

  it('writes a value with the unit of the system (NIST SP 811: 1 lb = 0.45359237 kg, 1 in = 0.0254 m, exact)', () => {
    expect(formatInUnits('mass', 45.359237, 'us-customary')).toBe('100 lb');
    expect(formatInUnits('displacement', 0.0254, 'us-customary')).toBe('1 in');
    expect(formatInUnits('displacement', 0.0125, 'si')).toBe('12.5 mm');
    expect(formatInUnits('mass', 300, 'us-customary', 6)).toBe('661.387 lb'); // 300 / 0.45359237 = 661.387…
  });
});
