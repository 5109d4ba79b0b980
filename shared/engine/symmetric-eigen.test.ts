import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { symmetricEigen } from './symmetric-eigen';
import { randomSpdMatrix, seededRandom } from './test-fixtures';

describe('symmetricEigen', () => {
  it('agrees with ml-matrix EigenvalueDecomposition and satisfies A v = λ v with orthonormal v', () => {
    const random = seededRandom(31);
    for (const n of [1, 2, 3, 10, 60]) {
      // Indefinite symmetric matrices too: the kernel does not need definiteness.
      const spd = randomSpdMatrix(n, random, 3);
      const rows = spd.map((row, i) => row.map((v, j) => v - (i === j ? 2 * n * 0.9 : 0)));
      const a = Float64Array.from(rows.flat());
      const { values, vectors } = symmetricEigen(a, n);
      const reference = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true }).realEigenvalues;
      const scale = Math.max(...values.map(Math.abs));
      for (let r = 0; r < n; r++) {
        expect(Math.abs(values[r] - reference[r]) / scale).toBeLessThan(1e-12);
        if (r > 0) expect(values[r]).toBeGreaterThanOrEqual(values[r - 1]);
        for (let i = 0; i < n; i++) {
          let s = 0;
          for (let k = 0; k < n; k++) s += rows[i][k] * vectors[r * n + k];
          expect(Math.abs(s - values[r] * vectors[r * n + i]) / scale).toBeLessThan(1e-12);
        }
        for (let q = 0; q < n; q++) {
          let dot = 0;
          for (let i = 0; i < n; i++) dot += vectors[r * n + i] * vectors[q * n + i];
          expect(Math.abs(dot - (r === q ? 1 : 0))).toBeLessThan(1e-12);
        }
      }
    }
  });

  it('handles repeated eigenvalues (identity and a block diagonal)', () => {
    const identity = symmetricEigen(Float64Array.of(1, 0, 0, 0, 1, 0, 0, 0, 1), 3);
    expect(Array.from(identity.values)).toEqual([1, 1, 1]);
    const block = symmetricEigen(Float64Array.of(2, 0, 0, 0, 3, 1, 0, 1, 3), 3);
    expect(block.values[0]).toBeCloseTo(2, 14);
    expect(block.values[1]).toBeCloseTo(2, 14);
    expect(block.values[2]).toBeCloseTo(4, 14);
  });
});
