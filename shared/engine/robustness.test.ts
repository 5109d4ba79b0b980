import { describe, expect, it } from 'vitest';
import { mapRobustness } from './robustness';
import { assessDesign } from './design';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem } from './response';
import { crowdModalForceN, equivalentPedestrianCount } from './loads/pedestrian-crowd';

const structure = { modalMassKg: 47000, frequencyHz: 1.84, dampingRatio: 0.006, direction: 'vertical' as const };
const tmd = { massKg: 1180, frequencyHz: 1.79, dampingRatio: 0.09 };
const loadCase = { kind: 'crowd' as const, guide: 'hivoss' as const, densityPerM2: 1.0, deckAreaM2: 160 };

/**
 * Every cell of the map against a dense 200 000-point sweep of the HiVoSS (2008) crowd band 1.25–2.3 Hz: within
 * 0.2 % and never more than 1e-6 below it (the continuous peak is at least the largest sample).
 */
function expectCellsMatchDenseSweep(
  mode: typeof structure,
  map: { peakAccelerationMPerS2: number[][] },
  sf: readonly number[],
  df: readonly number[],
  equivalentPedestrians: number,
): void {
  sf.forEach((s, i) => {
    df.forEach((d, j) => {
      const system = createModeTmdSystem({ ...mode, frequencyHz: mode.frequencyHz * s }, [{ ...tmd, dampingRatio: tmd.dampingRatio * d }]);
      const point = createModeTmdPoint(system);
      let dense = 0;
      for (let k = 0; k <= 200_000; k++) {
        const f = 1.25 + (1.05 * k) / 200_000;
        const a = evaluateModeTmdSystem(system, f, point).structureAccelerationMPerS2PerN;
        dense = Math.max(dense, a * crowdModalForceN('hivoss', 'vertical', equivalentPedestrians, 2 / Math.PI, f));
      }
      const cell = map.peakAccelerationMPerS2[i][j];
      expect(Math.abs(cell / dense - 1)).toBeLessThan(0.002);
      expect(cell).toBeGreaterThanOrEqual(dense * (1 - 1e-6));
    });
  });
}

describe('robustness map', () => {
  it('each cell is the continuous peak to 0.2 % (against a dense 200 000-point sweep)', () => {
    const sf = [0.85, 0.97, 1.0, 1.08, 1.15];
    const df = [0, 0.3, 1, 2.5];
    const map = mapRobustness({ structure, tmds: [tmd], loadCase, structureFrequencyFactors: sf, tmdDampingFactors: df });
    expectCellsMatchDenseSweep(structure, map, sf, df, equivalentPedestrianCount(160, 1.0, structure.dampingRatio));
  });

  it('the cell at factors (1, 1) is the assessed peak', () => {
    const map = mapRobustness({ structure, tmds: [tmd], loadCase, structureFrequencyFactors: [1], tmdDampingFactors: [1] });
    const a = assessDesign({ structure, tmds: [tmd], loadCase });
    expect(map.peakAccelerationMPerS2[0][0]).toBeCloseTo(a.peakAccelerationMPerS2, 12);
    expect(a.bareStructurePeakAccelerationMPerS2).not.toBeNull();
    expect(map.bareStructurePeakAccelerationMPerS2[0]).toBeCloseTo(a.bareStructurePeakAccelerationMPerS2 as number, 12);
  });

  it('undamped structure (ζ = 0): cells stay continuous peaks; bare entries null where the mode is loaded', () => {
    // HiVoSS 2008 crowd at 1.0 P/m²: n' = 1.85 √n, which does not depend on the damping ratio.
    const undamped = { ...structure, dampingRatio: 0 };
    const sf = [0.9, 1.0, 1.1, 1.3];
    const df = [0.5, 1, 2];
    const map = mapRobustness({ structure: undamped, tmds: [tmd], loadCase, structureFrequencyFactors: sf, tmdDampingFactors: df });
    const nEq = equivalentPedestrianCount(160, 1.0, 0);
    expect(nEq).toBeCloseTo(1.85 * Math.sqrt(160), 12);
    expectCellsMatchDenseSweep(undamped, map, sf, df, nEq);
    // 0.9, 1.0 and 1.1 × 1.84 Hz lie where the HiVoSS ψ > 0 (1.25–2.3 Hz): unbounded, null; 1.3 × 1.84 = 2.39 Hz
    // lies above the band, where the bare undamped peak is finite.
    expect(map.bareStructurePeakAccelerationMPerS2.slice(0, 3)).toEqual([null, null, null]);
    expect(typeof map.bareStructurePeakAccelerationMPerS2[3]).toBe('number');
    expect(map.warnings.map((w) => w.code)).toContain('bare-structure-unbounded');
    // The cell at (1, 1) is the assessed peak, also here.
    const a = assessDesign({ structure: undamped, tmds: [tmd], loadCase });
    expect(map.peakAccelerationMPerS2[1][1]).toBeCloseTo(a.peakAccelerationMPerS2, 12);
  });

  it('undamped structure: a damping factor of 0 leaves nothing damped and is refused, naming the factor', () => {
    const undamped = { ...structure, dampingRatio: 0 };
    expect(() => mapRobustness({ structure: undamped, tmds: [tmd], loadCase, structureFrequencyFactors: [1], tmdDampingFactors: [1, 0] })).toThrow(/unbounded/);
    try {
      mapRobustness({ structure: undamped, tmds: [tmd], loadCase, structureFrequencyFactors: [1], tmdDampingFactors: [1, 0] });
    } catch (error) {
      expect((error as { path?: string }).path).toBe('tmdDampingFactors.1');
    }
  });
});
