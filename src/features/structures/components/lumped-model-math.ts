/**
 * The arithmetic of the model editor around the engine: a chain of masses and springs as matrices, a chain read
 * back from matrices, mode shapes scaled for display and for a damper at one degree of freedom, and the times of a
 * free-vibration plot. SI throughout (kg, N/m, s, m).
 */

/**
 * A chain: mass i (kg) on the diagonal of M; spring 1 ties mass 1 to the ground and spring i (i ≥ 2) ties mass i − 1
 * to mass i, so K is tridiagonal with K[i][i] = k_i + k_(i+1), K[i][i+1] = K[i+1][i] = −k_(i+1).
 */
export function chainMatrices(massesKg: readonly number[], springsNPerM: readonly number[]): { massMatrixKg: number[][]; stiffnessMatrixNPerM: number[][] } {
  const n = massesKg.length;
  if (springsNPerM.length !== n) throw new RangeError(`a chain of ${n} masses needs ${n} springs (got ${springsNPerM.length})`);
  const massMatrixKg = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? massesKg[i] : 0)));
  const stiffnessMatrixNPerM = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    const k = springsNPerM[i];
    stiffnessMatrixNPerM[i][i] += k;
    if (i > 0) {
      stiffnessMatrixNPerM[i - 1][i - 1] += k;
      stiffnessMatrixNPerM[i - 1][i] -= k;
      stiffnessMatrixNPerM[i][i - 1] -= k;
    }
  }
  return { massMatrixKg, stiffnessMatrixNPerM };
}

/** The chain that gives these matrices, or null when they are not a chain's (M not diagonal, K not of chain form). */
export function matricesToChain(massMatrixKg: readonly (readonly number[])[], stiffnessMatrixNPerM: readonly (readonly number[])[]): { massesKg: number[]; springsNPerM: number[] } | null {
  const n = massMatrixKg.length;
  if (stiffnessMatrixNPerM.length !== n) return null;
  const massesKg: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) if (i !== j && massMatrixKg[i][j] !== 0) return null;
    massesKg.push(massMatrixKg[i][i]);
  }
  const springsNPerM = new Array<number>(n).fill(0);
  for (let i = 1; i < n; i++) springsNPerM[i] = -stiffnessMatrixNPerM[i - 1][i];
  for (let i = 0; i < n; i++) springsNPerM[i] = stiffnessMatrixNPerM[i][i] - (i + 1 < n ? springsNPerM[i + 1] : 0);
  const rebuilt = chainMatrices(massesKg, springsNPerM).stiffnessMatrixNPerM;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const scale = Math.max(Math.abs(stiffnessMatrixNPerM[i][i]), Math.abs(stiffnessMatrixNPerM[j][j]), 1);
      if (Math.abs(rebuilt[i][j] - stiffnessMatrixNPerM[i][j]) > 1e-9 * scale) return null;
    }
  }
  return { massesKg, springsNPerM };
}

/** Entries of a unit-max shape smaller than this are rounding noise of the eigen-solver: shown as 0 (a node). */
export const SHAPE_NOISE_FLOOR = 1e-12;

/** The shape scaled so that its entry of largest magnitude is +1 (for plots and tables); rounding noise becomes 0. */
export function scaleToUnitMax(shape: readonly number[]): number[] {
  let pivot = 0;
  for (let i = 1; i < shape.length; i++) if (Math.abs(shape[i]) > Math.abs(shape[pivot])) pivot = i;
  const divisor = shape[pivot];
  if (divisor === 0) return shape.map(() => 0);
  return shape.map((value) => {
    const scaled = value / divisor;
    return Math.abs(scaled) < SHAPE_NOISE_FLOOR ? 0 : scaled;
  });
}

/**
 * Modal mass of a mass-normalised mode (φᵀ M φ = 1) with the shape rescaled to 1 at degree of freedom `dofIndex`,
 * where a damper would sit: M = φᵀ M φ / φ_j² = 1 / φ_j². Infinite at a node (φ_j = 0): no damper works there.
 */
export function modalMassAtDofKg(massNormalisedShape: readonly number[], dofIndex: number): number {
  const value = massNormalisedShape[dofIndex];
  if (value === undefined) throw new RangeError(`dofIndex ${dofIndex} is outside the shape's ${massNormalisedShape.length} entries`);
  return 1 / (value * value);
}

/** `count` equally spaced times from 0 to `durationS` inclusive. */
export function sampleTimesS(durationS: number, count: number): Float64Array {
  if (!(durationS > 0) || !Number.isFinite(durationS)) throw new RangeError(`durationS must be a finite number > 0 (got ${durationS})`);
  if (!Number.isInteger(count) || count < 2) throw new RangeError(`count must be a whole number ≥ 2 (got ${count})`);
  const times = new Float64Array(count);
  for (let i = 0; i < count; i++) times[i] = (durationS * i) / (count - 1);
  return times;
}
