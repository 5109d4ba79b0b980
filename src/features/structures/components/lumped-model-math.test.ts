import { describe, expect, it } from 'vitest';
import { solveFreeVibration } from '../../../../shared/engine/free-vibration';
import { solveModes } from '../../../../shared/engine/modal';
import { chainMatrices, matricesToChain, modalMassAtDofKg, sampleTimesS, scaleToUnitMax } from './lumped-model-math';

describe('chainMatrices', () => {
  it('builds the tridiagonal stiffness of a grounded chain', () => {
    const { massMatrixKg, stiffnessMatrixNPerM } = chainMatrices([2, 3, 4], [10, 20, 30]);
    expect(massMatrixKg).toEqual([
      [2, 0, 0],
      [0, 3, 0],
      [0, 0, 4],
    ]);
    expect(stiffnessMatrixNPerM).toEqual([
      [30, -20, 0],
      [-20, 50, -30],
      [0, -30, 30],
    ]);
  });

  it('gives the closed-form frequencies of a uniform fixed–free chain', () => {
    // Closed form of n equal masses m on n equal springs k, fixed at one end and free at the other (common practice:
    // it follows from the recurrence of the chain's characteristic polynomial):
    // ω_r = 2 √(k/m) sin((2r − 1) π / (2 (2n + 1))), r = 1 … n.
    const n = 6;
    const massKg = 1500;
    const springNPerM = 2.4e6;
    const { massMatrixKg, stiffnessMatrixNPerM } = chainMatrices(new Array(n).fill(massKg), new Array(n).fill(springNPerM));
    const modes = solveModes(massMatrixKg, stiffnessMatrixNPerM);
    for (let r = 1; r <= n; r++) {
      const expected = 2 * Math.sqrt(springNPerM / massKg) * Math.sin(((2 * r - 1) * Math.PI) / (2 * (2 * n + 1)));
      expect(modes.angularFrequencyRadPerS[r - 1]).toBeCloseTo(expected, 9);
    }
  });

  it('refuses springs that do not match the masses', () => {
    expect(() => chainMatrices([1, 2], [3])).toThrow(/2 masses needs 2 springs/);
  });
});

describe('matricesToChain', () => {
  it('reads a chain back from its matrices', () => {
    const chain = { massesKg: [2, 3, 4], springsNPerM: [10, 20, 30] };
    const { massMatrixKg, stiffnessMatrixNPerM } = chainMatrices(chain.massesKg, chain.springsNPerM);
    expect(matricesToChain(massMatrixKg, stiffnessMatrixNPerM)).toEqual(chain);
  });

  it('answers null for matrices that are no chain', () => {
    expect(matricesToChain([[1, 0.1], [0.1, 1]], [[2, -1], [-1, 1]])).toBeNull();
    // A spring from the last mass to the ground is outside the chain form (K[1][1] would have to be k₂ = 1).
    expect(matricesToChain([[1, 0], [0, 1]], [[2, -1], [-1, 3]])).toBeNull();
  });
});

describe('modalMassAtDofKg', () => {
  it('is the mass itself for one degree of freedom', () => {
    const modes = solveModes([[25_000]], [[3.9e6]]);
    expect(modalMassAtDofKg(modes.shapes[0], 0)).toBeCloseTo(25_000, 6);
  });

  it('gives modal stiffness M ω² equal to φᵀ K φ of the shape scaled to 1 at that DOF', () => {
    // Rayleigh quotient identity for an eigenvector (common practice): φᵀ K φ = ω² φᵀ M φ.
    const { massMatrixKg, stiffnessMatrixNPerM } = chainMatrices([40_000, 30_000, 20_000], [9e6, 6e6, 3e6]);
    const modes = solveModes(massMatrixKg, stiffnessMatrixNPerM);
    for (let r = 0; r < 3; r++) {
      for (let j = 0; j < 3; j++) {
        const phi = modes.shapes[r].map((value) => value / modes.shapes[r][j]);
        let phiKphi = 0;
        for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) phiKphi += phi[a] * stiffnessMatrixNPerM[a][b] * phi[b];
        const modalMassKg = modalMassAtDofKg(modes.shapes[r], j);
        expect(modalMassKg * modes.eigenvaluesRad2PerS2[r]).toBeCloseTo(phiKphi, 3);
      }
    }
  });
});

describe('scaleToUnitMax and sampleTimesS', () => {
  it('scales the largest entry to +1', () => {
    expect(scaleToUnitMax([0.2, -0.4, 0.1])).toEqual([-0.5, 1, -0.25]);
  });

  it('shows the node of a symmetric model as 0, not as rounding noise', () => {
    // Three equal masses on a symmetric stiffness: mode 2 is antisymmetric with a node at the middle (common practice).
    const modes = solveModes([[1, 0, 0], [0, 1, 0], [0, 0, 1]], [[2, -1, 0], [-1, 2, -1], [0, -1, 2]]);
    const [first, middle, last] = scaleToUnitMax(modes.shapes[1]);
    expect(first).toBe(1);
    expect(middle).toBe(0);
    expect(last).toBeCloseTo(-1, 12);
  });

  it('spaces the times evenly from 0 to the duration', () => {
    expect(Array.from(sampleTimesS(2, 5))).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(() => sampleTimesS(0, 5)).toThrow(/durationS/);
  });

  it('feeds a free vibration that keeps its energy (undamped)', () => {
    // Energy conservation of an undamped free vibration (common practice): ½ ẋᵀ M ẋ + ½ xᵀ K x stays constant.
    const { massMatrixKg, stiffnessMatrixNPerM } = chainMatrices([1000, 800], [4e5, 2e5]);
    const timesS = sampleTimesS(3, 301);
    const result = solveFreeVibration({ massKg: massMatrixKg, stiffnessNPerM: stiffnessMatrixNPerM, initialDisplacementM: [0, 0.01], initialVelocityMPerS: [0.05, 0], timesS });
    const energyJ = (t: number) => {
      const x = [result.displacementM[2 * t], result.displacementM[2 * t + 1]];
      const v = [result.velocityMPerS[2 * t], result.velocityMPerS[2 * t + 1]];
      let e = 0;
      for (let a = 0; a < 2; a++) for (let b = 0; b < 2; b++) e += 0.5 * (v[a] * massMatrixKg[a][b] * v[b] + x[a] * stiffnessMatrixNPerM[a][b] * x[b]);
      return e;
    };
    const initial = energyJ(0);
    for (const t of [50, 150, 300]) expect(energyJ(t)).toBeCloseTo(initial, 9);
  });
});
