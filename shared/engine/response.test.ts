import { describe, expect, it } from 'vitest';
import Complex from 'complex.js';
import {
  createModeTmdPoint,
  createModeTmdSystem,
  evaluateModeTmdSystem,
  evaluateStructureAccelerationPerN,
  evaluateStructureReceptance,
  findResponsePeak,
} from './response';
import { buildModeTmdMatrices } from './matrices';
import { solveHarmonicResponse } from './harmonic';
import { solveModes } from './modal';
import { randomSpdMatrix, seededRandom } from './test-fixtures';

describe('single structure mode (no damper)', () => {
  const structure = { modalMassKg: 42000, frequencyHz: 2.07, dampingRatio: 0.007 };
  const system = createModeTmdSystem(structure, []);
  const stiffness = structure.modalMassKg * (2 * Math.PI * structure.frequencyHz) ** 2;

  it('has the resonant amplitude F/(2ζK) at ω = ω_n (single-DOF closed form)', () => {
    // Closed form of the damped single-DOF receptance at ω = ω_n (Clough & Penzien, Dynamics of Structures, chapter 3; from memory).
    const point = evaluateModeTmdSystem(system, structure.frequencyHz, createModeTmdPoint(system));
    expect(point.structureDisplacementMPerN).toBeCloseTo(1 / (2 * structure.dampingRatio * stiffness), 15);
    expect(point.structureDisplacementMPerN * stiffness).toBeCloseTo(1 / (2 * structure.dampingRatio), 9);
  });

  it('peaks in displacement at ω_n √(1 − 2ζ²) with F/(2ζ√(1−ζ²) K), and in acceleration at ω_n / √(1 − 2ζ²)', () => {
    // Closed forms of the damped single-DOF receptance (Clough & Penzien, Dynamics of Structures, chapter 3; from memory).
    const z = 0.2; // a large damping ratio makes the shift visible
    const damped = createModeTmdSystem({ ...structure, dampingRatio: z }, []);
    const displacement = findResponsePeak(damped, [0.5, 5], { quantity: 'structureDisplacement' });
    expect(displacement.frequencyHz / structure.frequencyHz).toBeCloseTo(Math.sqrt(1 - 2 * z * z), 6);
    expect(displacement.value * stiffness).toBeCloseTo(1 / (2 * z * Math.sqrt(1 - z * z)), 9);
    const acceleration = findResponsePeak(damped, [0.5, 5]);
    expect(acceleration.frequencyHz / structure.frequencyHz).toBeCloseTo(1 / Math.sqrt(1 - 2 * z * z), 6);
  });

  it('finds the narrow resonance of a lightly damped mode in a wide band', () => {
    const light = createModeTmdSystem({ ...structure, dampingRatio: 0.002 }, []);
    const peak = findResponsePeak(light, [0.3, 30], { quantity: 'structureDisplacement' });
    expect(peak.value * stiffness).toBeCloseTo(1 / (2 * 0.002 * Math.sqrt(1 - 0.002 ** 2)), 6);
  });

  it('reports an unbounded peak for an undamped mode in the band', () => {
    const undamped = createModeTmdSystem({ ...structure, dampingRatio: 0 }, []);
    expect(findResponsePeak(undamped, [1, 3])).toEqual({ frequencyHz: structure.frequencyHz, value: Infinity });
  });
});

describe('structure with dampers', () => {
  it('stands still at the own frequency of an undamped damper (anti-resonance, Den Hartog 1956)', () => {
    const system = createModeTmdSystem({ modalMassKg: 30000, frequencyHz: 1.9, dampingRatio: 0.01 }, [{ massKg: 600, frequencyHz: 1.84, dampingRatio: 0 }]);
    const point = evaluateModeTmdSystem(system, 1.84, createModeTmdPoint(system));
    expect(point.structureDisplacementMPerN).toBe(0);
    expect(Array.from(evaluateStructureReceptance(system, 1.84, new Float64Array(2)))).toEqual([0, 0]);
    // The damper's spring then carries the whole force: stroke = F / k.
    expect(point.tmdStrokeMPerN[0]).toBeCloseTo(1 / (600 * (2 * Math.PI * 1.84) ** 2), 15);
    const near = evaluateModeTmdSystem(system, 1.84 * (1 + 1e-9), createModeTmdPoint(system));
    expect(near.structureDisplacementMPerN).toBeLessThan(1e-12);
    expect(near.tmdStrokeMPerN[0]).toBeCloseTo(point.tmdStrokeMPerN[0], 12);
  });

  it('matches the two-DOF receptance written out with complex.js (Den Hartog 1956, structure + one damper)', () => {
    // X_s / F = (k − ω²m + iωc) / [(K + k − ω²M + iω(C + c))(k − ω²m + iωc) − (k + iωc)²]
    const structure = { modalMassKg: 25000, frequencyHz: 1.85, dampingRatio: 0.008 };
    const tmd = { massKg: 500, frequencyHz: 1.8, dampingRatio: 0.09 };
    const system = createModeTmdSystem(structure, [tmd]);
    const point = createModeTmdPoint(system);
    const receptance = new Float64Array(2);
    const bigK = structure.modalMassKg * (2 * Math.PI * structure.frequencyHz) ** 2;
    const bigC = 2 * structure.dampingRatio * structure.modalMassKg * 2 * Math.PI * structure.frequencyHz;
    const k = tmd.massKg * (2 * Math.PI * tmd.frequencyHz) ** 2;
    const c = 2 * tmd.dampingRatio * tmd.massKg * 2 * Math.PI * tmd.frequencyHz;
    for (const f of [0.5, 1.6, 1.75, 1.8, 1.85, 1.95, 2.4, 6]) {
      const w = 2 * Math.PI * f;
      const damper = new Complex(k - w * w * tmd.massKg, w * c);
      const coupling = new Complex(k, w * c);
      const determinant = new Complex(bigK + k - w * w * structure.modalMassKg, w * (bigC + c)).mul(damper).sub(coupling.mul(coupling));
      const xs = damper.div(determinant);
      const stroke = coupling.div(damper).sub(1).mul(xs); // X_a − X_s with X_a = (k + iωc) X_s / (k − ω²m + iωc)
      evaluateModeTmdSystem(system, f, point);
      evaluateStructureReceptance(system, f, receptance);
      expect(Math.abs(point.structureDisplacementMPerN / xs.abs() - 1)).toBeLessThan(1e-12);
      expect(Math.abs(point.tmdStrokeMPerN[0] / stroke.abs() - 1)).toBeLessThan(1e-12);
      expect(Math.abs(receptance[0] - xs.re) / xs.abs()).toBeLessThan(1e-12);
      expect(Math.abs(receptance[1] - xs.im) / xs.abs()).toBeLessThan(1e-12);
    }
  });

  it('agrees with the general complex solve of the assembled 1 + n matrices', () => {
    const structure = { modalMassKg: 18000, frequencyHz: 2.4, dampingRatio: 0.006 };
    const tmds = [
      { massKg: 150, frequencyHz: 2.2, dampingRatio: 0.05 },
      { massKg: 200, frequencyHz: 2.35, dampingRatio: 0.07 },
      { massKg: 120, frequencyHz: 2.5, dampingRatio: 0.04 },
    ];
    const system = createModeTmdSystem(structure, tmds);
    const matrices = buildModeTmdMatrices(structure, tmds);
    const frequenciesHz = Array.from({ length: 60 }, (_, i) => 1.5 + i * 0.03);
    const force = new Float64Array(4);
    force[0] = 1;
    const general = solveHarmonicResponse({ ...matrices, forceN: force, frequenciesHz });
    const point = createModeTmdPoint(system);
    const receptance = new Float64Array(2);
    frequenciesHz.forEach((f, p) => {
      evaluateModeTmdSystem(system, f, point);
      const xsRe = general.displacementReM[p * 4];
      const xsIm = general.displacementImM[p * 4];
      const xs = Math.hypot(xsRe, xsIm);
      expect(Math.abs(point.structureDisplacementMPerN / xs - 1)).toBeLessThan(1e-10);
      expect(point.structureAccelerationMPerS2PerN).toBeCloseTo((2 * Math.PI * f) ** 2 * point.structureDisplacementMPerN, 15);
      evaluateStructureReceptance(system, f, receptance);
      expect(Math.abs(receptance[0] - xsRe) / xs).toBeLessThan(1e-10);
      expect(Math.abs(receptance[1] - xsIm) / xs).toBeLessThan(1e-10);
      for (let j = 0; j < 3; j++) {
        const stroke = Math.hypot(general.displacementReM[p * 4 + 1 + j] - xsRe, general.displacementImM[p * 4 + 1 + j] - xsIm);
        expect(Math.abs(point.tmdStrokeMPerN[j] / stroke - 1)).toBeLessThan(1e-10);
      }
    });
    // The undamped coupled frequencies equal the modes of the assembled matrices.
    const modes = solveModes(matrices.massKg, matrices.stiffnessNPerM, 4);
    modes.frequencyHz.forEach((f, r) => expect(system.coupledFrequenciesHz[r]).toBeCloseTo(f, 10));
  });

  it('is reciprocal: the receptance matrix of a damped n-DOF system is symmetric (Maxwell–Betti)', () => {
    const random = seededRandom(41);
    const n = 5;
    const massKg = randomSpdMatrix(n, random, 20);
    const stiffnessNPerM = randomSpdMatrix(n, random, 2000);
    const dampingNsPerM = randomSpdMatrix(n, random, 30);
    const columns = Array.from({ length: n }, (_, j) => {
      const force = new Float64Array(n);
      force[j] = 1;
      return solveHarmonicResponse({ massKg, stiffnessNPerM, dampingNsPerM, forceN: force, frequenciesHz: [0.7, 1.9, 4.4] });
    });
    for (let p = 0; p < 3; p++) {
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const scale = Math.hypot(columns[j].displacementReM[p * n + i], columns[j].displacementImM[p * n + i]);
          expect(Math.abs(columns[j].displacementReM[p * n + i] - columns[i].displacementReM[p * n + j])).toBeLessThan(1e-10 * scale + 1e-300);
          expect(Math.abs(columns[j].displacementImM[p * n + i] - columns[i].displacementImM[p * n + j])).toBeLessThan(1e-10 * scale + 1e-300);
        }
      }
    }
  });

  it('finds the true continuous peak of random tuned systems (against a dense scan refined locally)', () => {
    const random = seededRandom(7);
    for (let trial = 0; trial < 40; trial++) {
      const fs = 1 + 2 * random();
      const mu = 0.005 + 0.08 * random();
      const count = 1 + Math.floor(random() * 3);
      const tmds = Array.from({ length: count }, () => ({
        massKg: (mu / count) * 10000,
        frequencyHz: fs * (0.9 + 0.15 * random()),
        dampingRatio: 0.01 + 0.15 * random(),
      }));
      const system = createModeTmdSystem({ modalMassKg: 10000, frequencyHz: fs, dampingRatio: 0.02 * random() }, tmds);
      const quantity = (['structureAcceleration', 'structureDisplacement', 'tmdStroke'] as const)[trial % 3];
      const band: [number, number] = [fs * 0.5, fs * 1.6];
      const peak = findResponsePeak(system, band, { quantity, tmdIndex: 0 });
      // Dense scan: 20,000 log-spaced points, then a fine local scan around the best one.
      const point = createModeTmdPoint(system);
      const value = (f: number) => {
        evaluateModeTmdSystem(system, f, point);
        return quantity === 'structureAcceleration' ? point.structureAccelerationMPerS2PerN : quantity === 'structureDisplacement' ? point.structureDisplacementMPerN : point.tmdStrokeMPerN[0];
      };
      let bestF = band[0];
      let best = 0;
      for (let i = 0; i <= 20000; i++) {
        const f = band[0] * (band[1] / band[0]) ** (i / 20000);
        const v = value(f);
        if (v > best) {
          best = v;
          bestF = f;
        }
      }
      for (let i = -1000; i <= 1000; i++) {
        const f = Math.min(band[1], Math.max(band[0], bestF * (1 + i * 1e-7)));
        best = Math.max(best, value(f));
      }
      expect(peak.value).toBeGreaterThanOrEqual(best * (1 - 1e-9));
      expect(peak.value).toBeLessThanOrEqual(best * (1 + 1e-6));
    }
  });

  it('applies a force weight, including a kink where the maximum sits', () => {
    const system = createModeTmdSystem({ modalMassKg: 20000, frequencyHz: 1.5, dampingRatio: 0.01 }, []);
    // Weight 0 below 1.6 Hz, rising linearly to 280 N at 1.7 Hz, 280 N above: above the resonance the product rises
    // along the ramp and falls after it, so the maximum is at the kink, 1.7 Hz.
    const weight = (f: number) => (f <= 1.6 ? 0 : f >= 1.7 ? 280 : (280 * (f - 1.6)) / 0.1);
    const peak = findResponsePeak(system, [1.55, 3], { forceWeight: weight });
    expect(Math.abs(peak.frequencyHz - 1.7)).toBeLessThan(1e-6);
    const point = evaluateModeTmdSystem(system, 1.7, createModeTmdPoint(system));
    // At a kink the value is exact to about relativeTolerance × |d ln(value)/d ln(f)|.
    expect(Math.abs(peak.value / (280 * point.structureAccelerationMPerS2PerN) - 1)).toBeLessThan(1e-5);
  });

  it('refuses bad parameters with the field named', () => {
    expect(() => createModeTmdSystem({ modalMassKg: 0, frequencyHz: 2, dampingRatio: 0.01 }, [])).toThrow(/structure.modalMassKg: must be a finite number greater than 0/);
    expect(() => createModeTmdSystem({ modalMassKg: 1, frequencyHz: 2, dampingRatio: 1 }, [])).toThrow(/structure.dampingRatio: must be a damping ratio in \[0, 1\)/);
    expect(() => createModeTmdSystem({ modalMassKg: 1, frequencyHz: 2, dampingRatio: 0 }, [{ massKg: 1, frequencyHz: -2, dampingRatio: 0.1 }])).toThrow(/tmds.0.frequencyHz/);
  });
});

describe('solveHarmonicResponse input checks', () => {
  // Common practice (a pure engine never returns NaN quietly): a non-finite force entry is refused by name.
  const matrices = {
    massKg: [
      [2, 0],
      [0, 1],
    ],
    stiffnessNPerM: [
      [300, -100],
      [-100, 100],
    ],
    dampingNsPerM: [
      [1, 0],
      [0, 0.5],
    ],
    frequenciesHz: [1],
  };
  it('refuses a non-finite real or imaginary force entry, naming it', () => {
    expect(() => solveHarmonicResponse({ ...matrices, forceN: [1, Number.NaN] })).toThrow(/forceN: entry 1 must be a finite number/);
    expect(() => solveHarmonicResponse({ ...matrices, forceN: [1, 0], forceImaginaryN: [Infinity, 0] })).toThrow(/forceImaginaryN: entry 0 must be a finite number/);
  });
});

describe('evaluateStructureAccelerationPerN', () => {
  // Common practice (one quantity, one value): the strokes-free path gives exactly the full evaluation's acceleration,
  // also at an undamped damper's own frequency, where the structure is at rest (Den Hartog 1956, anti-resonance).
  it('equals evaluateModeTmdSystem exactly, damped and at an undamped anti-resonance', () => {
    const damped = createModeTmdSystem({ modalMassKg: 30_000, frequencyHz: 2.1, dampingRatio: 0.006 }, [
      { massKg: 600, frequencyHz: 2.05, dampingRatio: 0.07 },
      { massKg: 300, frequencyHz: 2.2, dampingRatio: 0.05 },
    ]);
    const point = createModeTmdPoint(damped);
    for (const f of [0.3, 1.7, 2.0, 2.05, 2.1, 2.4, 6]) {
      expect(evaluateStructureAccelerationPerN(damped, f)).toBe(evaluateModeTmdSystem(damped, f, point).structureAccelerationMPerS2PerN);
    }
    const undamped = createModeTmdSystem({ modalMassKg: 30_000, frequencyHz: 2.1, dampingRatio: 0 }, [{ massKg: 600, frequencyHz: 2, dampingRatio: 0 }]);
    expect(evaluateStructureAccelerationPerN(undamped, 2)).toBe(0);
  });
});
