/**
 * Free vibration of an undamped n-DOF system from x(0) and ẋ(0), by modal superposition:
 *   x(t) = Σ_i φ_i q_i(t),  q_i(0) = φ_iᵀ M x(0),  q̇_i(0) = φ_iᵀ M ẋ(0)  (mass-normalised φ),
 *   q_i(t) = q_i(0) cos ω_i t + q̇_i(0)/ω_i sin ω_i t, and q_i(t) = q_i(0) + q̇_i(0) t for a rigid-body mode (ω_i = 0).
 */
import { EngineInputError, type SquareMatrixInput } from './linalg';
import { prepareMassAndStiffness, solvePreparedModes, type ModalSolution } from './modal';

export interface FreeVibrationInput {
  massKg: SquareMatrixInput;
  stiffnessNPerM: SquareMatrixInput;
  initialDisplacementM: ArrayLike<number>;
  initialVelocityMPerS: ArrayLike<number>;
  timesS: ArrayLike<number>;
}

export interface FreeVibrationResult {
  dofCount: number;
  modes: ModalSolution;
  /** Row-major timesS.length × dofCount. */
  displacementM: Float64Array;
  velocityMPerS: Float64Array;
}

function checkVector(value: ArrayLike<number>, length: number, name: string): void {
  if (!value || value.length !== length) {
    throw new EngineInputError(name, `${name}: must have ${length} entries, one per DOF (got ${value ? value.length : 0})`);
  }
  for (let i = 0; i < length; i++) {
    if (typeof value[i] !== 'number' || !Number.isFinite(value[i])) throw new EngineInputError(`${name}.${i}`, `${name}: entry ${i} must be a finite number`);
  }
}

export function solveFreeVibration(input: FreeVibrationInput): FreeVibrationResult {
  const { n, mass, stiffness } = prepareMassAndStiffness(input.massKg, input.stiffnessNPerM);
  checkVector(input.initialDisplacementM, n, 'initialDisplacementM');
  checkVector(input.initialVelocityMPerS, n, 'initialVelocityMPerS');
  const times = input.timesS;
  for (let t = 0; t < times.length; t++) {
    if (typeof times[t] !== 'number' || !Number.isFinite(times[t])) throw new EngineInputError(`timesS.${t}`, `timesS: entry ${t} must be a finite number`);
  }
  const modes = solvePreparedModes(n, mass, stiffness);
  const q0 = new Float64Array(n);
  const v0 = new Float64Array(n);
  const mx = new Float64Array(n);
  const mv = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let sx = 0;
    let sv = 0;
    for (let k = 0; k < n; k++) {
      sx += mass[i * n + k] * input.initialDisplacementM[k];
      sv += mass[i * n + k] * input.initialVelocityMPerS[k];
    }
    mx[i] = sx;
    mv[i] = sv;
  }
  for (let r = 0; r < n; r++) {
    const phi = modes.shapes[r];
    let a = 0;
    let b = 0;
    for (let i = 0; i < n; i++) {
      a += phi[i] * mx[i];
      b += phi[i] * mv[i];
    }
    q0[r] = a;
    v0[r] = b;
  }
  const displacementM = new Float64Array(times.length * n);
  const velocityMPerS = new Float64Array(times.length * n);
  for (let t = 0; t < times.length; t++) {
    const time = times[t];
    for (let r = 0; r < n; r++) {
      const omega = modes.angularFrequencyRadPerS[r];
      let q: number;
      let qd: number;
      if (omega === 0) {
        q = q0[r] + v0[r] * time;
        qd = v0[r];
      } else {
        const c = Math.cos(omega * time);
        const s = Math.sin(omega * time);
        q = q0[r] * c + (v0[r] / omega) * s;
        qd = -q0[r] * omega * s + v0[r] * c;
      }
      const phi = modes.shapes[r];
      for (let i = 0; i < n; i++) {
        displacementM[t * n + i] += phi[i] * q;
        velocityMPerS[t * n + i] += phi[i] * qd;
      }
    }
  }
  return { dofCount: n, modes, displacementM, velocityMPerS };
}
