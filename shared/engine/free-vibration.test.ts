import { describe, expect, it } from 'vitest';
import { solveFreeVibration } from './free-vibration';
import { randomChain, seededRandom } from './test-fixtures';

function energy(massKg: number[][], stiffnessNPerM: number[][], x: ArrayLike<number>, v: ArrayLike<number>): number {
  const n = massKg.length;
  let e = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) e += 0.5 * (v[i] * massKg[i][j] * v[j] + x[i] * stiffnessNPerM[i][j] * x[j]);
  return e;
}

describe('solveFreeVibration', () => {
  it('reproduces x(0), ẋ(0) and conserves energy (undamped: T + V constant, to 1e-9)', () => {
    const random = seededRandom(3);
    const { massKg, stiffnessNPerM } = randomChain(7, random);
    const x0 = Array.from({ length: 7 }, () => (random() - 0.5) * 0.02);
    const v0 = Array.from({ length: 7 }, () => (random() - 0.5) * 0.1);
    const timesS = Array.from({ length: 400 }, (_, i) => i * 0.013);
    const result = solveFreeVibration({ massKg, stiffnessNPerM, initialDisplacementM: x0, initialVelocityMPerS: v0, timesS });
    x0.forEach((x, i) => expect(result.displacementM[i]).toBeCloseTo(x, 14));
    v0.forEach((v, i) => expect(result.velocityMPerS[i]).toBeCloseTo(v, 13));
    const e0 = energy(massKg, stiffnessNPerM, x0, v0);
    for (let t = 0; t < timesS.length; t++) {
      const x = result.displacementM.subarray(t * 7, t * 7 + 7);
      const v = result.velocityMPerS.subarray(t * 7, t * 7 + 7);
      expect(Math.abs(energy(massKg, stiffnessNPerM, x, v) - e0) / e0).toBeLessThan(1e-9);
    }
  });

  it('matches the single-DOF closed form x = x0 cos ωt + v0/ω sin ωt', () => {
    // Undamped free vibration of one mass on a spring (Clough & Penzien, Dynamics of Structures, chapter 2; from memory).
    const m = 1200;
    const k = 2.3e5;
    const omega = Math.sqrt(k / m);
    const timesS = [0, 0.1, 0.77, 3.2];
    const result = solveFreeVibration({ massKg: [[m]], stiffnessNPerM: [[k]], initialDisplacementM: [0.004], initialVelocityMPerS: [-0.05], timesS });
    timesS.forEach((t, i) => expect(result.displacementM[i]).toBeCloseTo(0.004 * Math.cos(omega * t) + (-0.05 / omega) * Math.sin(omega * t), 14));
  });

  it('moves a rigid-body mode as a + b t (free–free chain: the centre of mass drifts at constant speed)', () => {
    const random = seededRandom(8);
    const { massKg, stiffnessNPerM } = randomChain(4, random, false);
    const masses = massKg.map((row, i) => row[i]);
    const totalMass = masses.reduce((a, b) => a + b, 0);
    const x0 = [0.01, -0.02, 0.005, 0];
    const v0 = [0.3, 0.1, -0.2, 0.05];
    const centre = (x: ArrayLike<number>) => masses.reduce((s, m, i) => s + m * x[i], 0) / totalMass;
    const c0 = centre(x0);
    const u0 = centre(v0);
    const timesS = [0, 0.5, 2, 10];
    const result = solveFreeVibration({ massKg, stiffnessNPerM, initialDisplacementM: x0, initialVelocityMPerS: v0, timesS });
    timesS.forEach((t, i) => expect(centre(result.displacementM.subarray(i * 4, i * 4 + 4))).toBeCloseTo(c0 + u0 * t, 12));
  });

  it('refuses initial vectors of the wrong length', () => {
    expect(() =>
      solveFreeVibration({ massKg: [[1]], stiffnessNPerM: [[1]], initialDisplacementM: [0, 1], initialVelocityMPerS: [0], timesS: [0] }),
    ).toThrow(/initialDisplacementM: must have 1 entries/);
  });
});
