/**
 * Small dense linear-algebra kernels on row-major Float64Array matrices (Cholesky, LU, Lyapunov), the engine's
 * input error and its checks of numbers and matrices. The symmetric eigenproblem has its own kernel
 * (symmetric-eigen.ts), the complex solve of the dynamic stiffness is in harmonic.ts.
 */

/** A square matrix given as nested rows or as a row-major Float64Array of n² entries. */
export type SquareMatrixInput = readonly (readonly number[])[] | Float64Array;

/** Thrown for input the engine refuses; `field` names the argument (and entry) at fault. */
export class EngineInputError extends RangeError {
  readonly field: string;
  constructor(field: string, message: string) {
    super(message);
    this.name = 'EngineInputError';
    this.field = field;
  }
}

/** Refuses anything but a finite number greater than 0, naming `field`. */
export function checkPositive(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || !(value > 0)) {
    throw new EngineInputError(field, `${field}: must be a finite number greater than 0 (got ${value})`);
  }
}

/** Refuses anything but a damping ratio in [0, 1), naming `field`. */
export function checkDampingRatio(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || value >= 1) {
    throw new EngineInputError(field, `${field}: must be a damping ratio in [0, 1) (got ${value})`);
  }
}

/**
 * Copies a square matrix into a row-major Float64Array, checking shape and finiteness.
 * `name` is used in the error messages.
 */
export function toSquareMatrix(value: SquareMatrixInput, name: string, dofCount?: number): { n: number; data: Float64Array } {
  if (value instanceof Float64Array) {
    const n = dofCount ?? Math.round(Math.sqrt(value.length));
    if (!Number.isInteger(n) || n < 1 || n * n !== value.length) {
      throw new EngineInputError(name, `${name}: a row-major square matrix needs n² entries (got ${value.length})`);
    }
    for (let i = 0; i < value.length; i++) {
      if (!Number.isFinite(value[i])) {
        throw new EngineInputError(`${name}.${Math.floor(i / n)}.${i % n}`, `${name}: entry (${Math.floor(i / n)}, ${i % n}) must be a finite number`);
      }
    }
    return { n, data: Float64Array.from(value) };
  }
  if (!Array.isArray(value) || value.length === 0) {
    throw new TypeError(`${name}: must be a non-empty array of rows`);
  }
  const n = value.length;
  if (dofCount !== undefined && n !== dofCount) {
    throw new EngineInputError(name, `${name}: must have ${dofCount} rows (got ${n})`);
  }
  const data = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = value[i];
    if (!Array.isArray(row) || row.length !== n) {
      throw new EngineInputError(`${name}.${i}`, `${name}: row ${i} must have ${n} entries (a square matrix)`);
    }
    for (let j = 0; j < n; j++) {
      const entry = row[j];
      if (typeof entry !== 'number' || !Number.isFinite(entry)) {
        throw new EngineInputError(`${name}.${i}.${j}`, `${name}: entry (${i}, ${j}) must be a finite number`);
      }
      data[i * n + j] = entry;
    }
  }
  return { n, data };
}

/** Relative tolerance of the symmetry check, against the largest entry of the matrix. */
export const SYMMETRY_TOLERANCE = 1e-9;

/** Checks symmetry (to SYMMETRY_TOLERANCE × largest entry) and replaces the matrix by its symmetric part. */
export function symmetrise(data: Float64Array, n: number, name: string): void {
  let largest = 0;
  for (let i = 0; i < n * n; i++) largest = Math.max(largest, Math.abs(data[i]));
  const tolerance = SYMMETRY_TOLERANCE * largest;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a = data[i * n + j];
      const b = data[j * n + i];
      if (Math.abs(a - b) > tolerance) {
        throw new EngineInputError(`${name}.${j}.${i}`, `${name}: must be symmetric (entry (${j}, ${i}) = ${b} differs from entry (${i}, ${j}) = ${a})`);
      }
      const mean = 0.5 * (a + b);
      data[i * n + j] = mean;
      data[j * n + i] = mean;
    }
  }
}

/**
 * Cholesky factor L (lower, row-major, in a new array) of a symmetric positive definite matrix, or null when the
 * matrix is not positive definite (a pivot not larger than 1e-14 × the largest diagonal entry).
 */
export function choleskyLower(data: Float64Array, n: number): Float64Array | null {
  const l = new Float64Array(n * n);
  let largestDiagonal = 0;
  for (let i = 0; i < n; i++) largestDiagonal = Math.max(largestDiagonal, data[i * n + i]);
  if (!(largestDiagonal > 0)) return null;
  const pivotFloor = 1e-14 * largestDiagonal;
  for (let j = 0; j < n; j++) {
    let sum = data[j * n + j];
    for (let k = 0; k < j; k++) sum -= l[j * n + k] * l[j * n + k];
    if (!(sum > pivotFloor)) return null;
    const diagonal = Math.sqrt(sum);
    l[j * n + j] = diagonal;
    for (let i = j + 1; i < n; i++) {
      let s = data[i * n + j];
      for (let k = 0; k < j; k++) s -= l[i * n + k] * l[j * n + k];
      l[i * n + j] = s / diagonal;
    }
  }
  return l;
}

/**
 * LU factorisation with partial pivoting of a real n×n row-major matrix, in place; returns the pivot rows, or
 * null when the matrix is singular.
 */
export function luFactor(a: Float64Array, n: number): Int32Array | null {
  const pivots = new Int32Array(n);
  let largest = 0;
  for (let i = 0; i < n * n; i++) largest = Math.max(largest, Math.abs(a[i]));
  const floor = 1e-300 + 1e-15 * largest;
  for (let k = 0; k < n; k++) {
    let p = k;
    let max = Math.abs(a[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const value = Math.abs(a[i * n + k]);
      if (value > max) {
        max = value;
        p = i;
      }
    }
    if (!(max > floor)) return null;
    pivots[k] = p;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j];
        a[k * n + j] = a[p * n + j];
        a[p * n + j] = t;
      }
    }
    const pivot = a[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const factor = (a[i * n + k] /= pivot);
      if (factor === 0) continue;
      for (let j = k + 1; j < n; j++) a[i * n + j] -= factor * a[k * n + j];
    }
  }
  return pivots;
}

/** Solves A x = b in place in `b` from the factors of luFactor. */
export function luSolve(lu: Float64Array, pivots: Int32Array, n: number, b: Float64Array): void {
  for (let k = 0; k < n; k++) {
    const p = pivots[k];
    if (p !== k) {
      const t = b[k];
      b[k] = b[p];
      b[p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = b[i];
    for (let j = 0; j < i; j++) s -= lu[i * n + j] * b[j];
    b[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let j = i + 1; j < n; j++) s -= lu[i * n + j] * b[j];
    b[i] = s / lu[i * n + i];
  }
}

/**
 * Solves the continuous Lyapunov equation A P + P Aᵀ + Q = 0 for symmetric P (A real n×n, stable; Q symmetric),
 * by writing the n(n+1)/2 independent equations as one dense linear system. Meant for small n (state spaces of
 * a few DOF). Returns P row-major, or null when the system is singular (A not stable).
 */
export function solveLyapunov(a: Float64Array, q: Float64Array, n: number): Float64Array | null {
  const m = (n * (n + 1)) / 2;
  const index = new Int32Array(n * n);
  let k = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      index[i * n + j] = k;
      index[j * n + i] = k;
      k++;
    }
  }
  const system = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  let row = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      // (A P)_ij + (P Aᵀ)_ij = Σ_k A_ik P_kj + Σ_k P_ik A_jk
      for (let kk = 0; kk < n; kk++) {
        system[row * m + index[kk * n + j]] += a[i * n + kk];
        system[row * m + index[i * n + kk]] += a[j * n + kk];
      }
      rhs[row] = -q[i * n + j];
      row++;
    }
  }
  const pivots = luFactor(system, m);
  if (!pivots) return null;
  luSolve(system, pivots, m, rhs);
  const p = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) p[i] = rhs[index[i]];
  return p;
}
