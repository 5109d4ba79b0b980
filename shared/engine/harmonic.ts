/**
 * Damped steady-state response of a general n-DOF system: (K − ω² M + iω C) X = F, x(t) = Re(X e^{iωt}).
 * Complex Gaussian elimination with partial pivoting on separate real and imaginary Float64Arrays; the work
 * arrays are allocated once per call, not per frequency.
 */
import { EngineInputError, toSquareMatrix, type SquareMatrixInput } from './linalg';

export interface HarmonicResponseInput {
  massKg: SquareMatrixInput;
  dampingNsPerM: SquareMatrixInput;
  stiffnessNPerM: SquareMatrixInput;
  /** Real part of the force amplitude vector in N (in phase with cos ωt). */
  forceN: ArrayLike<number>;
  /** Imaginary part of the force amplitude vector in N (default zero). */
  forceImaginaryN?: ArrayLike<number>;
  frequenciesHz: ArrayLike<number>;
  dofCount?: number;
}

export interface HarmonicResponse {
  dofCount: number;
  /** Row-major frequencies × dofCount: real and imaginary parts of the displacement amplitude in m. */
  displacementReM: Float64Array;
  displacementImM: Float64Array;
}

export function solveHarmonicResponse(input: HarmonicResponseInput): HarmonicResponse {
  const m = toSquareMatrix(input.massKg, 'massKg', input.dofCount);
  const n = m.n;
  // Given n, toSquareMatrix refuses a damping or stiffness matrix of another size than the mass matrix.
  const c = toSquareMatrix(input.dampingNsPerM, 'dampingNsPerM', n);
  const k = toSquareMatrix(input.stiffnessNPerM, 'stiffnessNPerM', n);
  const forceRe = input.forceN;
  const forceIm = input.forceImaginaryN;
  if (!forceRe || forceRe.length !== n) throw new EngineInputError('forceN', `forceN: must have ${n} entries`);
  if (forceIm && forceIm.length !== n) throw new EngineInputError('forceImaginaryN', `forceImaginaryN: must have ${n} entries`);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(forceRe[i])) throw new EngineInputError(`forceN.${i}`, `forceN: entry ${i} must be a finite number (got ${forceRe[i]})`);
    if (forceIm && !Number.isFinite(forceIm[i])) {
      throw new EngineInputError(`forceImaginaryN.${i}`, `forceImaginaryN: entry ${i} must be a finite number (got ${forceIm[i]})`);
    }
  }
  const frequencies = input.frequenciesHz;
  const count = frequencies.length;
  const outRe = new Float64Array(count * n);
  const outIm = new Float64Array(count * n);
  const aRe = new Float64Array(n * n);
  const aIm = new Float64Array(n * n);
  const bRe = new Float64Array(n);
  const bIm = new Float64Array(n);
  for (let p = 0; p < count; p++) {
    const f = frequencies[p];
    if (!Number.isFinite(f) || f < 0) throw new EngineInputError(`frequenciesHz.${p}`, `frequenciesHz: entry ${p} must be a finite number ≥ 0`);
    const omega = 2 * Math.PI * f;
    const omega2 = omega * omega;
    for (let i = 0; i < n * n; i++) {
      aRe[i] = k.data[i] - omega2 * m.data[i];
      aIm[i] = omega * c.data[i];
    }
    for (let i = 0; i < n; i++) {
      bRe[i] = forceRe[i];
      bIm[i] = forceIm ? forceIm[i] : 0;
    }
    if (!complexSolveInPlace(aRe, aIm, bRe, bIm, n)) {
      throw new EngineInputError(`frequenciesHz.${p}`, `frequenciesHz: the dynamic stiffness is singular at ${f} Hz (an undamped resonance)`);
    }
    outRe.set(bRe, p * n);
    outIm.set(bIm, p * n);
  }
  return { dofCount: n, displacementReM: outRe, displacementImM: outIm };
}

/** Solves (aRe + i aIm) x = b in place (b ← x); false when singular. */
export function complexSolveInPlace(aRe: Float64Array, aIm: Float64Array, bRe: Float64Array, bIm: Float64Array, n: number): boolean {
  let largest = 0;
  for (let i = 0; i < n * n; i++) largest = Math.max(largest, Math.hypot(aRe[i], aIm[i]));
  const floor = 1e-300 + 1e-15 * largest;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    let max = -1;
    for (let i = col; i < n; i++) {
      const value = Math.hypot(aRe[i * n + col], aIm[i * n + col]);
      if (value > max) {
        max = value;
        pivot = i;
      }
    }
    if (!(max > floor)) return false;
    if (pivot !== col) {
      for (let j = 0; j < n; j++) {
        let t = aRe[col * n + j];
        aRe[col * n + j] = aRe[pivot * n + j];
        aRe[pivot * n + j] = t;
        t = aIm[col * n + j];
        aIm[col * n + j] = aIm[pivot * n + j];
        aIm[pivot * n + j] = t;
      }
      let t = bRe[col];
      bRe[col] = bRe[pivot];
      bRe[pivot] = t;
      t = bIm[col];
      bIm[col] = bIm[pivot];
      bIm[pivot] = t;
    }
    const pRe = aRe[col * n + col];
    const pIm = aIm[col * n + col];
    const p2 = pRe * pRe + pIm * pIm;
    for (let i = col + 1; i < n; i++) {
      const xRe = aRe[i * n + col];
      const xIm = aIm[i * n + col];
      if (xRe === 0 && xIm === 0) continue;
      // factor = x / p
      const fRe = (xRe * pRe + xIm * pIm) / p2;
      const fIm = (xIm * pRe - xRe * pIm) / p2;
      for (let j = col; j < n; j++) {
        const yRe = aRe[col * n + j];
        const yIm = aIm[col * n + j];
        aRe[i * n + j] -= fRe * yRe - fIm * yIm;
        aIm[i * n + j] -= fRe * yIm + fIm * yRe;
      }
      const yRe = bRe[col];
      const yIm = bIm[col];
      bRe[i] -= fRe * yRe - fIm * yIm;
      bIm[i] -= fRe * yIm + fIm * yRe;
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let sRe = bRe[i];
    let sIm = bIm[i];
    for (let j = i + 1; j < n; j++) {
      const uRe = aRe[i * n + j];
      const uIm = aIm[i * n + j];
      sRe -= uRe * bRe[j] - uIm * bIm[j];
      sIm -= uRe * bIm[j] + uIm * bRe[j];
    }
    const pRe = aRe[i * n + i];
    const pIm = aIm[i * n + i];
    const p2 = pRe * pRe + pIm * pIm;
    bRe[i] = (sRe * pRe + sIm * pIm) / p2;
    bIm[i] = (sIm * pRe - sRe * pIm) / p2;
  }
  return true;
}
