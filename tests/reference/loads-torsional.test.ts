/**
 * Torsional modes of a footbridge deck.
 *  - EN 1990:2002/A1:2005 Annex A2, A2.4.3.2: comfort criteria are to be checked when the deck's frequency is below
 *    5 Hz for vertical modes and below 2.5 Hz for horizontal (lateral) and torsional modes; recommended maximum
 *    accelerations 0.7 m/s² vertical, 0.2 m/s² horizontal in normal use, 0.4 m/s² under exceptional crowd
 *    conditions — confirmed (national-annex notes quoting it). The code gives no separate torsional value:
 *    Stillspan applies the horizontal limits (the torsional modes share their 2.5 Hz trigger), our reading, stated
 *    in the verdict's caution.
 *  - The load: the vertical pedestrian force on the vertical ordinates of the eccentric mode shape — HiVoSS 2008
 *    crowd model (280 N per person, n' = 1.85 √n from 1 P/m²; confirmed) with the mean |φ| over the deck given by
 *    the engineer. For a half-sine twist varying linearly across the width and scaled to 1 at the deck edge,
 *    mean |φ| = (2/π)(1/2) = 1/π (closed form).
 * Closed form of the steady resonance: a = F / (2 ζ M), continuous maximum ×1/√(1−ζ²). The deck is invented.
 */
import { describe, expect, it } from 'vitest';
import { assessDesign } from '../../shared/engine/design';
import { resolveComfortLimit } from '../../shared/engine/criteria';

// Invented deck: torsional mode at 2.0 Hz, modal mass 120 t (scaled to 1 at the edge), ζ = 1 %, 1.0 P/m² on 400 m².
const torsional = { modalMassKg: 120000, frequencyHz: 2.0, dampingRatio: 0.01, direction: 'torsional' as const };
const crowd = { kind: 'crowd' as const, guide: 'hivoss' as const, densityPerM2: 1.0, deckAreaM2: 400, modeShapeMean: 1 / Math.PI };

describe('EN 1990 A2.4.3.2 on a torsional mode', () => {
  it('horizontal limits 0.2 (normal use) and 0.4 m/s² (exceptional crowd), checked below 2.5 Hz', () => {
    expect(resolveComfortLimit({ set: 'en1990', class: 'normal-use' }, 'torsional').limitMPerS2(2)).toBe(0.2);
    expect(resolveComfortLimit({ set: 'en1990', class: 'crowd' }, 'torsional').limitMPerS2(2)).toBe(0.4);
    expect(resolveComfortLimit({ set: 'en1990', class: 'crowd' }, 'torsional').applicableRangeHz).toEqual([0, 2.5]);
    // The vertical mode keeps 0.7 m/s² and 5 Hz.
    expect(resolveComfortLimit({ set: 'en1990', class: 'crowd' }, 'vertical').applicableRangeHz).toEqual([0, 5]);
  });

  it('assess: a = 280 N × 1.85 √n × (1/π) / (2 ζ M), verdict against 0.4 m/s²', () => {
    const a = assessDesign({ structure: torsional, tmds: [], loadCase: crowd, criteria: { set: 'en1990', class: 'crowd' } });
    const closed = (280 * 37 * (1 / Math.PI)) / (2 * 0.01 * 120000);
    expect(closed).toBeCloseTo(1.374, 3);
    expect(a.peakAccelerationMPerS2 / closed).toBeCloseTo(1 / Math.sqrt(1 - 0.01 ** 2), 6);
    expect(a.criterion?.limitMPerS2).toBe(0.4);
    expect(a.verdict).toBe('fail');
    expect(a.criterion?.caution).toMatch(/torsional/);
    expect(a.warnings.map((w) => w.code)).not.toContain('structure-frequency-outside-criteria');
  });

  it('a torsional mode at 3 Hz lies above the 2.5 Hz trigger: the answer says so', () => {
    const stiff = { ...torsional, frequencyHz: 3.0 };
    const a = assessDesign({
      structure: stiff, tmds: [], loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [2.5, 3.5] },
      criteria: { set: 'en1990', class: 'normal-use' },
    });
    expect(a.warnings.map((w) => w.code)).toContain('structure-frequency-outside-criteria');
  });

  it('the guides\' comfort tables give no torsional limit: refused with a pointer to EN 1990', () => {
    expect(() => assessDesign({ structure: torsional, tmds: [], loadCase: crowd, criteria: { set: 'hivoss', class: 'CL1' } })).toThrow(/en1990/);
  });
});
