import { describe, expect, it } from 'vitest';
import { buildModeTmdMatrices } from './matrices';
import { solveHarmonicResponse } from './harmonic';

describe('buildModeTmdMatrices', () => {
  it('assembles M, C, K of one mode with two dampers in absolute coordinates', () => {
    const structure = { modalMassKg: 20000, frequencyHz: 2, dampingRatio: 0.01 };
    const tmds = [
      { massKg: 300, frequencyHz: 1.9, dampingRatio: 0.08 },
      { massKg: 200, frequencyHz: 2.05, dampingRatio: 0.06 },
    ];
    const { dofCount, massKg, dampingNsPerM, stiffnessNPerM } = buildModeTmdMatrices(structure, tmds);
    expect(dofCount).toBe(3);
    const w = (f: number) => 2 * Math.PI * f;
    const k1 = 300 * w(1.9) ** 2;
    const k2 = 200 * w(2.05) ** 2;
    const c1 = 2 * 0.08 * 300 * w(1.9);
    const c2 = 2 * 0.06 * 200 * w(2.05);
    expect(Array.from(massKg)).toEqual([20000, 0, 0, 0, 300, 0, 0, 0, 200]);
    const expectedK = [20000 * w(2) ** 2 + k1 + k2, -k1, -k2, -k1, k1, 0, -k2, 0, k2];
    const expectedC = [2 * 0.01 * 20000 * w(2) + c1 + c2, -c1, -c2, -c1, c1, 0, -c2, 0, c2];
    expectedK.forEach((v, i) => expect(stiffnessNPerM[i]).toBeCloseTo(v, 6));
    expectedC.forEach((v, i) => expect(dampingNsPerM[i]).toBeCloseTo(v, 9));
  });
});

describe('solveHarmonicResponse', () => {
  it('gives the static deflection at 0 Hz and refuses an undamped resonance', () => {
    // X = F / k at ω = 0, unbounded at ω = √(k/m) without damping: single-DOF closed forms (common practice).
    const k = 5e5;
    const result = solveHarmonicResponse({ massKg: [[100]], dampingNsPerM: [[0]], stiffnessNPerM: [[k]], forceN: [250], frequenciesHz: [0] });
    expect(result.displacementReM[0]).toBeCloseTo(250 / k, 15);
    expect(result.displacementImM[0]).toBe(0);
    const fn = Math.sqrt(k / 100) / (2 * Math.PI);
    expect(() => solveHarmonicResponse({ massKg: [[100]], dampingNsPerM: [[0]], stiffnessNPerM: [[k]], forceN: [1], frequenciesHz: [fn] })).toThrow(
      /frequenciesHz: the dynamic stiffness is singular/,
    );
  });

  it('lags the force by 90° at resonance (single-DOF closed form: X = F / (iωc))', () => {
    // At ω = ω_n stiffness and inertia cancel and X = F / (iωc) (Clough & Penzien, Dynamics of Structures, chapter 3; from memory).
    const m = 100;
    const k = 4e5;
    const c = 2 * 0.02 * Math.sqrt(k * m);
    const omega = Math.sqrt(k / m);
    const result = solveHarmonicResponse({ massKg: [[m]], dampingNsPerM: [[c]], stiffnessNPerM: [[k]], forceN: [1], frequenciesHz: [omega / (2 * Math.PI)] });
    expect(Math.abs(result.displacementReM[0])).toBeLessThan(1e-9 / (omega * c));
    expect(result.displacementImM[0]).toBeCloseTo(-1 / (omega * c), 14);
  });
});
