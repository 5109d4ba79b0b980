import { describe, expect, it } from 'vitest';
import { criticalPedestrians, criticalPedestriansBare, largestRealPart } from './lateral-lock-in';

// Invented lateral mode.
const mode = { modalMassKg: 118000, frequencyHz: 0.92, dampingRatio: 0.006 };

describe('lateral lock-in', () => {
  it('the eigenvalue test of the bare mode crosses zero exactly at 8π ζ f M / k', () => {
    const n = criticalPedestriansBare(mode);
    expect(largestRealPart(mode, [], -0.5 * 300 * n * 0.999)).toBeLessThan(0);
    expect(largestRealPart(mode, [], -0.5 * 300 * n * 1.001)).toBeGreaterThan(0);
    expect(criticalPedestrians(mode, [])).toBe(n);
  });

  it('a tuned damper raises the critical number', () => {
    const bare = criticalPedestriansBare(mode);
    const withDamper = criticalPedestrians(mode, [{ massKg: 2360, frequencyHz: 0.9, dampingRatio: 0.085 }]);
    expect(withDamper).toBeGreaterThan(3 * bare);
  });

  it('with a vanishing damper the coupled value tends to the bare one', () => {
    const bare = criticalPedestriansBare(mode);
    const tiny = criticalPedestrians(mode, [{ massKg: 1e-3, frequencyHz: 1.7, dampingRatio: 0.05 }]);
    expect(tiny / bare).toBeCloseTo(1, 4);
  });

  it('an undamped mode (ζ = 0) has N_L = 8π ζ f M / k = 0 (Dallard et al. 2001); a damped damper gives it a positive one', () => {
    const undamped = { ...mode, dampingRatio: 0 };
    expect(criticalPedestriansBare(undamped)).toBe(0);
    expect(criticalPedestrians(undamped, [])).toBe(0);
    expect(criticalPedestrians(undamped, [{ massKg: 2360, frequencyHz: 0.9, dampingRatio: 0 }])).toBe(0);
    const withDamper = criticalPedestrians(undamped, [{ massKg: 2360, frequencyHz: 0.9, dampingRatio: 0.085 }]);
    expect(withDamper).toBeGreaterThan(0);
    // The eigenvalue test confirms the crossing.
    const damper = [{ massKg: 2360, frequencyHz: 0.9, dampingRatio: 0.085 }];
    expect(largestRealPart(undamped, damper, -0.5 * 300 * withDamper * 0.99)).toBeLessThan(0);
    expect(largestRealPart(undamped, damper, -0.5 * 300 * withDamper * 1.01)).toBeGreaterThan(0);
  });

  it('refuses a coefficient that is not positive', () => {
    expect(() => criticalPedestriansBare(mode, 0)).toThrow(/lockInCoefficientNsPerM/);
  });
});
