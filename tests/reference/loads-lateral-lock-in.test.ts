/**
 * Lateral lock-in: P. Dallard, A. J. Fitzpatrick, A. Flint, S. Le Bourva, A. Low, R. M. Ridsdill Smith and
 * M. Willford, "The London Millennium Footbridge", The Structural Engineer 79(22), 2001:
 * N_L = 8 π ζ f M / k for a half-sine mode, k ≈ 300 N s/m per person on 0.5–1.0 Hz — confirmed (J. H. G. Macdonald,
 * Proc. R. Soc. A 465, 2009, quoting the formula and k).
 */
import { describe, expect, it } from 'vitest';
import { criticalPedestrians, criticalPedestriansBare } from '../../shared/engine/loads/lateral-lock-in';
import { assessDesign } from '../../shared/engine/design';

describe('critical number of pedestrians', () => {
  it('hand-evaluated formula', () => {
    // Invented lateral mode: ζ = 0.7 %, f = 0.9 Hz, M = 130 t: 8π × 0.007 × 0.9 × 130 000 / 300 = 68.6.
    const n = criticalPedestriansBare({ modalMassKg: 130000, frequencyHz: 0.9, dampingRatio: 0.007 });
    expect(n).toBeCloseTo((8 * Math.PI * 0.007 * 0.9 * 130000) / 300, 9);
    expect(n).toBeCloseTo(68.61, 2);
  });

  it('a damper raises the threshold, and assess reports the coupled value and the people on the deck', () => {
    const mode = { modalMassKg: 130000, frequencyHz: 0.9, dampingRatio: 0.007 };
    const tmd = { massKg: 2600, frequencyHz: 0.88, dampingRatio: 0.09 };
    const withDamper = criticalPedestrians(mode, [tmd]);
    expect(withDamper).toBeGreaterThan(criticalPedestriansBare(mode));
    const a = assessDesign({
      structure: { ...mode, direction: 'lateral' },
      tmds: [tmd],
      loadCase: { kind: 'lateral', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 500 },
    });
    expect(a.lockIn?.criticalPedestrians).toBeCloseTo(withDamper, 9);
    expect(a.lockIn?.expectedPedestrians).toBe(250);
    expect(a.lockIn?.source).toMatch(/Dallard/);
  });
});
