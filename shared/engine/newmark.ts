/**
 * Newmark time integration, average-acceleration variant (γ = 1/2, β = 1/4: unconditionally stable, no numerical
 * damping), of M ẍ + C ẋ + K x = f(t) (N. M. Newmark, J. Eng. Mech. Div. ASCE 85, 1959; the effective-stiffness form as
 * in Chopra, Dynamics of Structures). The effective stiffness K̂ = K + γ/(βΔt) C + 1/(βΔt²) M is factored once;
 * each step costs one force evaluation and one pair of triangular solves.
 */
import { EngineInputError, checkPositive, luFactor, luSolve } from './linalg';

export interface NewmarkInput {
  dofCount: number;
  massKg: Float64Array;
  dampingNsPerM: Float64Array;
  stiffnessNPerM: Float64Array;
  timeStepS: number;
  stepCount: number;
  initialDisplacementM?: Float64Array;
  initialVelocityMPerS?: Float64Array;
  /** Fills `out` (dofCount entries, zeroed before the call) with the force vector in N at time `timeS`. */
  force: (timeS: number, out: Float64Array) => void;
}

export interface NewmarkResult {
  timesS: Float64Array;
  /** Row-major (stepCount + 1) × dofCount. */
  displacementM: Float64Array;
  velocityMPerS: Float64Array;
  accelerationMPerS2: Float64Array;
}

const GAMMA = 0.5;
const BETA = 0.25;

export function integrateNewmark(input: NewmarkInput): NewmarkResult {
  const n = input.dofCount;
  if (!Number.isInteger(n) || n < 1) throw new EngineInputError('dofCount', `dofCount: must be an integer ≥ 1 (got ${n})`);
  for (const [name, matrix] of [['massKg', input.massKg], ['dampingNsPerM', input.dampingNsPerM], ['stiffnessNPerM', input.stiffnessNPerM]] as const) {
    if (!(matrix instanceof Float64Array) || matrix.length !== n * n) throw new EngineInputError(name, `${name}: must be a row-major Float64Array of ${n * n} entries`);
    for (let i = 0; i < n * n; i++) if (!Number.isFinite(matrix[i])) throw new EngineInputError(name, `${name}: entry ${i} must be finite`);
  }
  const dt = input.timeStepS;
  checkPositive(dt, 'timeStepS');
  const steps = input.stepCount;
  if (!Number.isInteger(steps) || steps < 0) throw new EngineInputError('stepCount', `stepCount: must be an integer ≥ 0 (got ${steps})`);
  if (typeof input.force !== 'function') throw new TypeError('force: must be a function (timeS, out) => void');
  const m = input.massKg;
  const c = input.dampingNsPerM;
  const k = input.stiffnessNPerM;
  const rows = steps + 1;
  const timesS = new Float64Array(rows);
  const x = new Float64Array(rows * n);
  const v = new Float64Array(rows * n);
  const a = new Float64Array(rows * n);
  if (input.initialDisplacementM) {
    if (input.initialDisplacementM.length !== n) throw new EngineInputError('initialDisplacementM', `initialDisplacementM: must have ${n} entries`);
    x.set(input.initialDisplacementM, 0);
  }
  if (input.initialVelocityMPerS) {
    if (input.initialVelocityMPerS.length !== n) throw new EngineInputError('initialVelocityMPerS', `initialVelocityMPerS: must have ${n} entries`);
    v.set(input.initialVelocityMPerS, 0);
  }
  const f = new Float64Array(n);
  const rhs = new Float64Array(n);
  // Initial acceleration from M a0 = f0 − C v0 − K x0.
  input.force(0, f);
  for (let i = 0; i < n; i++) {
    let s = f[i];
    for (let j = 0; j < n; j++) s -= c[i * n + j] * v[j] + k[i * n + j] * x[j];
    rhs[i] = s;
  }
  const mFactor = Float64Array.from(m);
  const mPivots = luFactor(mFactor, n);
  if (!mPivots) throw new EngineInputError('massKg', 'massKg: must be non-singular');
  luSolve(mFactor, mPivots, n, rhs);
  a.set(rhs, 0);
  // Effective stiffness and the constants of the incremental form.
  const a0 = 1 / (BETA * dt * dt);
  const a1 = GAMMA / (BETA * dt);
  const kHat = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) kHat[i] = k[i] + a1 * c[i] + a0 * m[i];
  const pivots = luFactor(kHat, n);
  if (!pivots) throw new EngineInputError('stiffnessNPerM', 'the effective stiffness K + 2C/Δt + 4M/Δt² is singular');
  const a2 = 1 / (BETA * dt);
  const a3 = 1 / (2 * BETA) - 1;
  const a4 = GAMMA / BETA - 1;
  const a5 = dt * (GAMMA / (2 * BETA) - 1);
  const mTerm = new Float64Array(n);
  const cTerm = new Float64Array(n);
  for (let step = 1; step <= steps; step++) {
    const t = step * dt;
    timesS[step] = t;
    f.fill(0);
    input.force(t, f);
    const prev = (step - 1) * n;
    const cur = step * n;
    for (let i = 0; i < n; i++) {
      mTerm[i] = a0 * x[prev + i] + a2 * v[prev + i] + a3 * a[prev + i];
      cTerm[i] = a1 * x[prev + i] + a4 * v[prev + i] + a5 * a[prev + i];
    }
    for (let i = 0; i < n; i++) {
      let s = f[i];
      for (let j = 0; j < n; j++) s += m[i * n + j] * mTerm[j] + c[i * n + j] * cTerm[j];
      rhs[i] = s;
    }
    luSolve(kHat, pivots, n, rhs);
    for (let i = 0; i < n; i++) {
      const xn = rhs[i];
      const an = a0 * (xn - x[prev + i]) - a2 * v[prev + i] - a3 * a[prev + i];
      x[cur + i] = xn;
      a[cur + i] = an;
      v[cur + i] = v[prev + i] + dt * ((1 - GAMMA) * a[prev + i] + GAMMA * an);
    }
  }
  return { timesS, displacementM: x, velocityMPerS: v, accelerationMPerS2: a };
}
