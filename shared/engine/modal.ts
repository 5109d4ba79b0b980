/**
 * Undamped modes of an n-DOF system: K φ = ω² M φ with M symmetric positive definite and K symmetric positive
 * semi-definite. Cholesky reduction M = L Lᵀ turns it into the standard symmetric eigenproblem
 * (L⁻¹ K L⁻ᵀ) y = λ y, solved by Householder tridiagonalisation + implicit QL (symmetric-eigen.ts, the algorithm
 * of ml-matrix's EigenvalueDecomposition on flat Float64Arrays, about 2.5× faster); φ = L⁻ᵀ y.
 * Modes are sorted by frequency, mass-normalised (φᵀ M φ = 1) and signed so that the entry of largest magnitude
 * is positive. Eigenvalues within RIGID_BODY_TOLERANCE × the largest one of zero are rigid-body modes (ω = 0).
 */
import { symmetricEigen } from './symmetric-eigen';
import { EngineInputError, choleskyLower, symmetrise, toSquareMatrix, type SquareMatrixInput } from './linalg';

/** |λ| ≤ this × max |λ| is a rigid-body mode; λ below −this × max |λ| means K is not positive semi-definite. */
export const RIGID_BODY_TOLERANCE = 1e-10;

export interface ModalSolution {
  dofCount: number;
  /** ω² in (rad/s)², ascending. */
  eigenvaluesRad2PerS2: Float64Array;
  angularFrequencyRadPerS: Float64Array;
  frequencyHz: Float64Array;
  /** shapes[i] is mode i's shape (dofCount entries), mass-normalised. */
  shapes: number[][];
}

/** Checked, symmetrised copies of M and K; throws EngineInputError naming `massKg` / `stiffnessNPerM`. */
export function prepareMassAndStiffness(massKg: SquareMatrixInput, stiffnessNPerM: SquareMatrixInput, dofCount?: number) {
  const m = toSquareMatrix(massKg, 'massKg', dofCount);
  const k = toSquareMatrix(stiffnessNPerM, 'stiffnessNPerM', m.n); // refuses a size other than massKg's
  symmetrise(m.data, m.n, 'massKg');
  symmetrise(k.data, k.n, 'stiffnessNPerM');
  return { n: m.n, mass: m.data, stiffness: k.data };
}

export function solveModes(massKg: SquareMatrixInput, stiffnessNPerM: SquareMatrixInput, dofCount?: number): ModalSolution {
  const { n, mass, stiffness } = prepareMassAndStiffness(massKg, stiffnessNPerM, dofCount);
  return solvePreparedModes(n, mass, stiffness);
}

/** solveModes on matrices already checked and symmetrised by prepareMassAndStiffness (only read). */
export function solvePreparedModes(n: number, mass: Float64Array, stiffness: Float64Array): ModalSolution {
  const l = choleskyLower(mass, n);
  if (!l) throw new EngineInputError('massKg', 'massKg: must be positive definite (its Cholesky factorisation failed)');
  // W = L⁻¹ K, then A = L⁻¹ Wᵀ = L⁻¹ K L⁻ᵀ (K symmetric). Row-oriented substitutions: contiguous inner loops.
  const forward = (source: Float64Array, target: Float64Array) => {
    for (let i = 0; i < n; i++) {
      const row = i * n;
      for (let col = 0; col < n; col++) target[row + col] = source[row + col];
      for (let k = 0; k < i; k++) {
        const factor = l[row + k];
        if (factor === 0) continue;
        const other = k * n;
        for (let col = 0; col < n; col++) target[row + col] -= factor * target[other + col];
      }
      const diagonal = l[row + i];
      for (let col = 0; col < n; col++) target[row + col] /= diagonal;
    }
  };
  const w = new Float64Array(n * n);
  forward(stiffness, w);
  const wt = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) wt[i * n + j] = w[j * n + i];
  const a = new Float64Array(n * n);
  forward(wt, a);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const mean = 0.5 * (a[i * n + j] + a[j * n + i]);
      a[i * n + j] = mean;
      a[j * n + i] = mean;
    }
  }
  const { values, vectors } = symmetricEigen(a, n); // ascending; vectors as rows
  let largest = 0;
  for (let r = 0; r < n; r++) largest = Math.max(largest, Math.abs(values[r]));
  // Y (columns = eigenvectors in frequency order, each of unit length, so that φᵀ M φ = yᵀ y = 1).
  const y = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    let norm = 0;
    for (let i = 0; i < n; i++) norm += vectors[r * n + i] * vectors[r * n + i];
    norm = Math.sqrt(norm);
    for (let i = 0; i < n; i++) y[i * n + r] = vectors[r * n + i] / norm;
  }
  // Φ = L⁻ᵀ Y: back substitution with Lᵀ, all modes at once.
  const phi = new Float64Array(n * n);
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    for (let col = 0; col < n; col++) phi[row + col] = y[row + col];
    for (let k = i + 1; k < n; k++) {
      const factor = l[k * n + i];
      if (factor === 0) continue;
      const other = k * n;
      for (let col = 0; col < n; col++) phi[row + col] -= factor * phi[other + col];
    }
    const diagonal = l[row + i];
    for (let col = 0; col < n; col++) phi[row + col] /= diagonal;
  }
  const eigenvaluesRad2PerS2 = new Float64Array(n);
  const angularFrequencyRadPerS = new Float64Array(n);
  const frequencyHz = new Float64Array(n);
  const shapes: number[][] = new Array(n);
  for (let r = 0; r < n; r++) {
    let lambda = values[r];
    if (Math.abs(lambda) <= RIGID_BODY_TOLERANCE * largest) lambda = 0;
    if (lambda < 0) {
      throw new EngineInputError(
        'stiffnessNPerM',
        `stiffnessNPerM: must be positive semi-definite (the system has an eigenvalue ω² = ${lambda} (rad/s)² < 0)`,
      );
    }
    eigenvaluesRad2PerS2[r] = lambda;
    angularFrequencyRadPerS[r] = Math.sqrt(lambda);
    frequencyHz[r] = angularFrequencyRadPerS[r] / (2 * Math.PI);
    // Sign: the entry of largest magnitude positive (the first such entry when several tie to 1e-9).
    let pivot = 0;
    let pivotMagnitude = -1;
    for (let i = 0; i < n; i++) {
      const magnitude = Math.abs(phi[i * n + r]);
      if (magnitude > pivotMagnitude * (1 + 1e-9)) {
        pivotMagnitude = magnitude;
        pivot = i;
      }
    }
    const sign = phi[pivot * n + r] < 0 ? -1 : 1;
    const shape = new Array<number>(n);
    for (let i = 0; i < n; i++) shape[i] = sign * phi[i * n + r];
    shapes[r] = shape;
  }
  return { dofCount: n, eigenvaluesRad2PerS2, angularFrequencyRadPerS, frequencyHz, shapes };
}
