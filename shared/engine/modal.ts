/**
 * Undamped modes of an n-DOF system: K φ = ω² M φ with M symmetric positive definite and K symmetric positive
 * semi-definite. Cholesky reduction M = L Lᵀ turns it into the standard symmetric eigenproblem
 * (L⁻¹ K L⁻ᵀ) y = λ y, solved by ml-matrix (Householder tridiagonalisation + implicit QL); φ = L⁻ᵀ y.
 * Modes are sorted by frequency, mass-normalised (φᵀ M φ = 1) and signed so that the entry of largest magnitude
 * is positive. Eigenvalues within RIGID_BODY_TOLERANCE × the largest one of zero are rigid-body modes (ω = 0).
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
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
  const k = toSquareMatrix(stiffnessNPerM, 'stiffnessNPerM', m.n);
  if (k.n !== m.n) throw new EngineInputError('stiffnessNPerM', `stiffnessNPerM: must be ${m.n}×${m.n} like massKg (got ${k.n}×${k.n})`);
  symmetrise(m.data, m.n, 'massKg');
  symmetrise(k.data, k.n, 'stiffnessNPerM');
  return { n: m.n, mass: m.data, stiffness: k.data };
}

export function solveModes(massKg: SquareMatrixInput, stiffnessNPerM: SquareMatrixInput, dofCount?: number): ModalSolution {
  const { n, mass, stiffness } = prepareMassAndStiffness(massKg, stiffnessNPerM, dofCount);
  const l = choleskyLower(mass, n);
  if (!l) throw new EngineInputError('massKg', 'massKg: must be positive definite (its Cholesky factorisation failed)');
  // W = L⁻¹ K (forward substitution on each column), then A = W L⁻ᵀ = L⁻¹ (L⁻¹ K)ᵀ as K is symmetric.
  const w = new Float64Array(n * n);
  const forward = (source: Float64Array, target: Float64Array) => {
    for (let col = 0; col < n; col++) {
      for (let i = 0; i < n; i++) {
        let s = source[i * n + col];
        for (let k = 0; k < i; k++) s -= l[i * n + k] * target[k * n + col];
        target[i * n + col] = s / l[i * n + i];
      }
    }
  };
  forward(stiffness, w);
  const wt = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) wt[i * n + j] = w[j * n + i];
  const a = new Float64Array(n * n);
  forward(wt, a);
  const rows: number[][] = new Array(n);
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n);
    for (let j = 0; j < n; j++) row[j] = 0.5 * (a[i * n + j] + a[j * n + i]);
    rows[i] = row;
  }
  let values: number[];
  let vectors: Matrix;
  if (n === 1) {
    values = [rows[0][0]];
    vectors = new Matrix([[1]]);
  } else {
    const decomposition = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
    values = decomposition.realEigenvalues;
    vectors = decomposition.eigenvectorMatrix;
  }
  let largest = 0;
  for (const value of values) largest = Math.max(largest, Math.abs(value));
  const order = values.map((_, i) => i).sort((p, q) => values[p] - values[q]);
  const eigenvaluesRad2PerS2 = new Float64Array(n);
  const angularFrequencyRadPerS = new Float64Array(n);
  const frequencyHz = new Float64Array(n);
  const shapes: number[][] = new Array(n);
  const y = new Float64Array(n);
  for (let r = 0; r < n; r++) {
    const mode = order[r];
    let lambda = values[mode];
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
    for (let i = 0; i < n; i++) y[i] = vectors.get(i, mode);
    // φ = L⁻ᵀ y (back substitution with Lᵀ).
    const phi = new Array<number>(n);
    for (let i = n - 1; i >= 0; i--) {
      let s = y[i];
      for (let k = i + 1; k < n; k++) s -= l[k * n + i] * phi[k];
      phi[i] = s / l[i * n + i];
    }
    // Normalise φᵀ M φ = 1 (y is unit length up to rounding) and sign: the largest-magnitude entry positive.
    let modalMass = 0;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mass[i * n + k] * phi[k];
      modalMass += phi[i] * s;
    }
    let pivot = 0;
    let pivotMagnitude = -1;
    for (let i = 0; i < n; i++) {
      if (Math.abs(phi[i]) > pivotMagnitude * (1 + 1e-9)) {
        pivotMagnitude = Math.abs(phi[i]);
        pivot = i;
      }
    }
    const scale = (phi[pivot] < 0 ? -1 : 1) / Math.sqrt(modalMass);
    for (let i = 0; i < n; i++) phi[i] *= scale;
    shapes[r] = phi;
  }
  return { dofCount: n, eigenvaluesRad2PerS2, angularFrequencyRadPerS, frequencyHz, shapes };
}
