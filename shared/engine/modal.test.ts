import { describe, expect, it } from 'vitest';
import { eigs, sqrtm, inv, multiply } from 'mathjs';
import { solveModes } from './modal';
import { randomChain, randomSpdMatrix, seededRandom } from './test-fixtures';

function matVec(a: number[][], x: number[]): number[] {
  return a.map((row) => row.reduce((s, v, j) => s + v * x[j], 0));
}
function maxAbs(a: number[][]): number {
  return Math.max(...a.map((row) => Math.max(...row.map(Math.abs))));
}

describe('solveModes', () => {
  it('satisfies K Φ = M Φ Λ and Φᵀ M Φ = I to 1e-9 (random SPD M, random SPD K)', () => {
    const random = seededRandom(11);
    for (const n of [1, 2, 5, 12, 40]) {
      const massKg = randomSpdMatrix(n, random, 10);
      const stiffnessNPerM = randomSpdMatrix(n, random, 1000);
      const solution = solveModes(massKg, stiffnessNPerM);
      const kScale = maxAbs(stiffnessNPerM);
      for (let r = 0; r < n; r++) {
        const phi = solution.shapes[r];
        const kPhi = matVec(stiffnessNPerM, phi);
        const mPhi = matVec(massKg, phi);
        const lambda = solution.eigenvaluesRad2PerS2[r];
        const phiNorm = Math.max(...phi.map(Math.abs));
        for (let i = 0; i < n; i++) {
          expect(Math.abs(kPhi[i] - lambda * mPhi[i]) / (kScale * phiNorm)).toBeLessThan(1e-9);
        }
        for (let s = 0; s < n; s++) {
          const other = solution.shapes[s];
          const product = other.reduce((acc, v, i) => acc + v * mPhi[i], 0);
          expect(Math.abs(product - (r === s ? 1 : 0))).toBeLessThan(1e-9);
        }
        // Largest-magnitude entry positive; frequencies ascending and consistent.
        const largest = phi.reduce((best, v) => (Math.abs(v) > Math.abs(best) ? v : best), 0);
        expect(largest).toBeGreaterThan(0);
        if (r > 0) expect(solution.frequencyHz[r]).toBeGreaterThanOrEqual(solution.frequencyHz[r - 1]);
        expect(solution.frequencyHz[r]).toBeCloseTo(solution.angularFrequencyRadPerS[r] / (2 * Math.PI), 12);
      }
    }
  });

  it('agrees with mathjs eigs on M^(-1/2) K M^(-1/2) (an independent route: matrix square root, no Cholesky)', () => {
    // Second opinion: mathjs (npm), sqrtm + eigs on the symmetric standard form.
    const random = seededRandom(23);
    for (const n of [2, 4, 9]) {
      const massKg = randomSpdMatrix(n, random, 5);
      const stiffnessNPerM = randomSpdMatrix(n, random, 300);
      const mInvSqrt = inv(sqrtm(massKg) as number[][]) as number[][];
      const a = multiply(multiply(mInvSqrt, stiffnessNPerM), mInvSqrt) as number[][];
      const symmetric = a.map((row, i) => row.map((v, j) => 0.5 * (v + a[j][i])));
      const reference = eigs(symmetric);
      const values = (reference.values as number[]).slice().sort((p, q) => p - q);
      const solution = solveModes(massKg, stiffnessNPerM);
      values.forEach((lambda, r) => {
        expect(Math.abs(solution.eigenvaluesRad2PerS2[r] - lambda) / values[n - 1]).toBeLessThan(1e-9);
      });
      // Shapes: φ = M^(-1/2) v, compared up to sign after mass normalisation (distinct eigenvalues here).
      for (const { value, vector } of reference.eigenvectors) {
        const r = values.findIndex((v) => Math.abs(v - (value as number)) < 1e-9 * values[n - 1]);
        const phi = matVec(mInvSqrt, vector as number[]);
        const norm = Math.sqrt(phi.reduce((s, v, i) => s + v * matVec(massKg, phi)[i], 0));
        const sign = Math.sign(phi.reduce((best, v) => (Math.abs(v) > Math.abs(best) ? v : best), 0));
        phi.forEach((v, i) => expect(Math.abs((sign * v) / norm - solution.shapes[r][i])).toBeLessThan(1e-7));
      }
    }
  });

  it('solves a 2-DOF chain in closed form', () => {
    // Two equal masses m, two equal springs k, fixed at one end: ω² = (3 ∓ √5)/2 · k/m (common textbook closed form
    // of the fixed–free two-mass chain; the numbers here are our own).
    const m = 350;
    const k = 8.2e4;
    const solution = solveModes(
      [
        [m, 0],
        [0, m],
      ],
      [
        [2 * k, -k],
        [-k, k],
      ],
    );
    expect(solution.eigenvaluesRad2PerS2[0]).toBeCloseTo(((3 - Math.sqrt(5)) / 2) * (k / m), 9);
    expect(solution.eigenvaluesRad2PerS2[1]).toBeCloseTo(((3 + Math.sqrt(5)) / 2) * (k / m), 9);
    // Shape ratio x2/x1 = (1+√5)/2 for the first mode (golden ratio), both entries positive.
    expect(solution.shapes[0][1] / solution.shapes[0][0]).toBeCloseTo((1 + Math.sqrt(5)) / 2, 12);
  });

  it('handles rigid-body modes of a free–free chain (K positive semi-definite) as ω = 0', () => {
    const random = seededRandom(5);
    const { massKg, stiffnessNPerM } = randomChain(6, random, false);
    const solution = solveModes(massKg, stiffnessNPerM);
    expect(solution.frequencyHz[0]).toBe(0);
    expect(solution.frequencyHz[1]).toBeGreaterThan(0);
    // The rigid-body shape is uniform: φ = 1/√(Σm) on every DOF.
    const totalMass = massKg.reduce((s, row, i) => s + row[i], 0);
    solution.shapes[0].forEach((v) => expect(v).toBeCloseTo(1 / Math.sqrt(totalMass), 12));
  });

  it('solves 200 DOF and accepts a row-major Float64Array', () => {
    const random = seededRandom(99);
    const { massKg, stiffnessNPerM } = randomChain(200, random);
    const flat = (a: number[][]) => Float64Array.from(a.flat());
    const solution = solveModes(flat(massKg), flat(stiffnessNPerM), 200);
    expect(solution.shapes).toHaveLength(200);
    const phi = solution.shapes[199];
    const kPhi = matVec(stiffnessNPerM, phi);
    const mPhi = matVec(massKg, phi);
    const scale = maxAbs(stiffnessNPerM) * Math.max(...phi.map(Math.abs));
    kPhi.forEach((v, i) => expect(Math.abs(v - solution.eigenvaluesRad2PerS2[199] * mPhi[i]) / scale).toBeLessThan(1e-9));
  });

  it('refuses bad input with a message naming the argument and the rule', () => {
    expect(() => solveModes([[1, 0], [0, -1]], [[1, 0], [0, 1]])).toThrow(/massKg: must be positive definite/);
    expect(() => solveModes([[1, 0.5], [0.4, 1]], [[1, 0], [0, 1]])).toThrow(/massKg: must be symmetric/);
    expect(() => solveModes([[1, 0], [0, 1]], [[1, 0], [0, -3]])).toThrow(/stiffnessNPerM: must be positive semi-definite/);
    expect(() => solveModes([[1, 0], [0]], [[1, 0], [0, 1]])).toThrow(/massKg: row 1 must have 2 entries/);
    expect(() => solveModes([[1, 0], [0, Number.NaN]], [[1, 0], [0, 1]])).toThrow(/massKg: entry \(1, 1\) must be a finite number/);
    expect(() => solveModes([[1]], [[1, 0], [0, 1]])).toThrow(/stiffnessNPerM: must have 1 rows/);
  });
});
