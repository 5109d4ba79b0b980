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

  describe('undamped structure (ζ_s = 0)', () => {
    // Invented undamped mode under a harmonic force over a band that contains its frequency.
    const undamped = { modalMassKg: 50000, frequencyHz: 2.0, dampingRatio: 0, direction: 'vertical' as const };
    const harmonic = { kind: 'harmonic' as const, modalForceAmplitudeN: 300, pacingRangeHz: [1.5, 2.5] as [number, number] };
    for (const method of ['den-hartog', 'hinf'] as const) {
      it(`${method}: still the smallest mass ratio, re-checked by assess at the tolerance edges; bare worst null`, () => {
        const limit = 0.5;
        const r = 0.05;
        const s = sizeDamper({ structure: undamped, method, loadCase: harmonic, peakAccelerationLimitMPerS2: limit, structureFrequencyToleranceRatio: r });
        expect(s.bareStructureWorstPeakAccelerationMPerS2).toBeNull();
        expect(s.warnings.map((w) => w.code)).toContain('bare-structure-unbounded');
        const tmd = s.tmd!;
        expect(tmd.dampingRatio).toBeGreaterThan(0);
        for (let i = 0; i <= 20; i++) {
          const fs = undamped.frequencyHz * (1 - r + (2 * r * i) / 20);
          const a = assessDesign({ structure: { ...undamped, frequencyHz: fs }, tmds: [tmd], loadCase: harmonic });
          expect(a.peakAccelerationMPerS2).toBeLessThanOrEqual(limit * (1 + 1e-6));
          expect(a.bareStructurePeakAccelerationMPerS2).toBeNull();
        }
        // 1 % lighter, tuned the same way: fails somewhere in the band.
        const mu = 0.99 * s.massRatio;
        const ratios = tuningRatios(method, mu, 0);
        const lighter = { massKg: mu * undamped.modalMassKg, frequencyHz: ratios.frequencyRatio * undamped.frequencyHz, dampingRatio: ratios.tmdDampingRatio };
        let worst = 0;
        for (let i = 0; i <= 80; i++) {
          const fs = undamped.frequencyHz * (1 - r + (2 * r * i) / 80);
          worst = Math.max(worst, assessDesign({ structure: { ...undamped, frequencyHz: fs }, tmds: [lighter], loadCase: harmonic }).peakAccelerationMPerS2);
        }
        expect(worst).toBeGreaterThan(limit);
      });
    }

    it('no tolerance, Den Hartog: the peak √(1+2/μ)-type amplification sets μ ≈ 2 / (a_lim M / F)² (Den Hartog 1956)', () => {
      // The optimum's displacement peak lies just above √(1+2/μ); the acceleration peak a bit higher (ω² weighting),
      // so the sized μ is a little above the fixed-point estimate 2 / ((a_lim M / F)² − 1) but of the same size.
      const limit = 0.5;
      const s = sizeDamper({ structure: undamped, method: 'den-hartog', loadCase: harmonic, peakAccelerationLimitMPerS2: limit });
      const amplification = (limit * undamped.modalMassKg) / 300;
      const estimate = 2 / (amplification * amplification - 1);
      expect(s.massRatio).toBeGreaterThan(estimate);
      expect(s.massRatio).toBeLessThan(1.5 * estimate);
    });

    it('a structure-frequency band wholly outside the load: the bare worst stays a finite number', () => {
      const s = sizeDamper({ structure: { ...undamped, frequencyHz: 3.0 }, method: 'den-hartog', loadCase: harmonic, peakAccelerationLimitMPerS2: 0.05, structureFrequencyToleranceRatio: 0.05 });
      expect(typeof s.bareStructureWorstPeakAccelerationMPerS2).toBe('number');
      expect(s.massRatio).toBe(0);
      expect(s.warnings.map((w) => w.code)).toContain('no-damper-needed');
      // Undamped receptance at the nearest pair (band edge 2.5 Hz, structure 2.85 Hz): F r²/(M (1 − r²)).
      const r = 2.5 / 2.85;
      expect(s.bareStructureWorstPeakAccelerationMPerS2 as number).toBeCloseTo((300 * r * r) / (50000 * (1 - r * r)), 6);
    });
  });
});
