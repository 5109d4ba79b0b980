import { describe, expect, it } from 'vitest';
import { sizeDamper, tuningRatios } from './sizing';
import { assessDesign } from './design';

// Invented footbridge mode.
const structure = { modalMassKg: 61000, frequencyHz: 2.02, dampingRatio: 0.004, direction: 'vertical' as const };
const loadCase = { kind: 'crowd' as const, guide: 'setra' as const, densityPerM2: 0.8, deckAreaM2: 210 };

describe('size', () => {
  for (const method of ['den-hartog', 'ioi-ikeda', 'hinf'] as const) {
    it(`${method}: the answer meets the limit at every tolerance edge (re-checked by assess) and is minimal to 1 %`, () => {
      const limit = 0.7;
      const r = 0.1;
      const s = sizeDamper({ structure, method, loadCase, peakAccelerationLimitMPerS2: limit, structureFrequencyToleranceRatio: r });
      expect(s.tmd).not.toBeNull();
      const tmd = s.tmd!;
      expect(tmd.massKg).toBeCloseTo(s.massRatio * structure.modalMassKg, 6);
      for (const factor of [1 - r, 1, 1 + r]) {
        const a = assessDesign({ structure: { ...structure, frequencyHz: structure.frequencyHz * factor }, tmds: [tmd], loadCase });
        expect(a.peakAccelerationMPerS2).toBeLessThanOrEqual(limit * (1 + 1e-6));
        expect(a.peakAccelerationMPerS2).toBeLessThanOrEqual(s.worstPeakAccelerationMPerS2 * (1 + 1e-6));
      }
      // Inside the band too (41 structure frequencies), and the reported stroke bounds every one of them.
      for (let i = 0; i <= 40; i++) {
        const fs = structure.frequencyHz * (1 - r + (2 * r * i) / 40);
        const a = assessDesign({ structure: { ...structure, frequencyHz: fs }, tmds: [tmd], loadCase });
        expect(a.peakAccelerationMPerS2).toBeLessThanOrEqual(limit * (1 + 1e-6));
        expect(a.tmdStrokeM[0]).toBeLessThanOrEqual((s.tmdStrokeM as number) * (1 + 1e-6));
      }
      expect(s.hardware?.springRateNPerM).toBeCloseTo(tmd.massKg * (2 * Math.PI * tmd.frequencyHz) ** 2, 6);
      // A damper 1 % lighter, tuned by the same method to the nominal frequency, fails somewhere in the band.
      const mu = 0.99 * s.massRatio;
      const ratios = tuningRatios(method, mu, structure.dampingRatio);
      const lighter = { massKg: mu * structure.modalMassKg, frequencyHz: ratios.frequencyRatio * structure.frequencyHz, dampingRatio: ratios.tmdDampingRatio };
      let worst = 0;
      for (let i = 0; i <= 80; i++) {
        const fs = structure.frequencyHz * (1 - r + (2 * r * i) / 80);
        worst = Math.max(worst, assessDesign({ structure: { ...structure, frequencyHz: fs }, tmds: [lighter], loadCase }).peakAccelerationMPerS2);
      }
      expect(worst).toBeGreaterThan(limit);
      const smaller = sizeDamper({ structure, method, loadCase, peakAccelerationLimitMPerS2: limit * 1.02, structureFrequencyToleranceRatio: r });
      expect(smaller.massRatio).toBeLessThan(s.massRatio);
    });
  }

  it('a wider tolerance needs a heavier damper', () => {
    const narrow = sizeDamper({ structure, method: 'den-hartog', loadCase, peakAccelerationLimitMPerS2: 0.5, structureFrequencyToleranceRatio: 0 });
    const wide = sizeDamper({ structure, method: 'den-hartog', loadCase, peakAccelerationLimitMPerS2: 0.5, structureFrequencyToleranceRatio: 0.15 });
    expect(wide.massRatio).toBeGreaterThan(narrow.massRatio);
  });

  it('answers no damper when the bare structure already meets the limit', () => {
    const s = sizeDamper({ structure, method: 'den-hartog', loadCase, peakAccelerationLimitMPerS2: 50 });
    expect(s.massRatio).toBe(0);
    expect(s.tmd).toBeNull();
    expect(s.warnings.map((w) => w.code)).toContain('no-damper-needed');
  });

  it('refuses a limit no damper up to the maximum mass ratio can meet', () => {
    expect(() => sizeDamper({ structure, method: 'den-hartog', loadCase, peakAccelerationLimitMPerS2: 1e-4 })).toThrow(/no damper up to/);
  });
});
