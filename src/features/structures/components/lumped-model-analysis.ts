/**
 * What the model editor computes as the engineer types: the matrices of the entered model (a chain or full
 * matrices), its undamped modes from the engine, and a free vibration from initial conditions. Every refusal is a
 * sentence naming the entry at fault, never NaN.
 */
import { EngineInputError } from '../../../../shared/engine/linalg';
import { solveFreeVibration } from '../../../../shared/engine/free-vibration';
import { solveModes, type ModalSolution } from '../../../../shared/engine/modal';
import { chainMatrices, sampleTimesS } from './lumped-model-math';

export type ModelEntry = 'chain' | 'matrices';

export interface ModelInput {
  entry: ModelEntry;
  dofLabels: readonly string[];
  massesKg: readonly (number | undefined)[];
  springsNPerM: readonly (number | undefined)[];
  massMatrixKg: readonly (readonly (number | undefined)[])[];
  stiffnessMatrixNPerM: readonly (readonly (number | undefined)[])[];
}

export interface ModelMatrices {
  massMatrixKg: number[][];
  stiffnessMatrixNPerM: number[][];
}

export type ModelAnalysis =
  | { ok: true; matrices: ModelMatrices; modes: ModalSolution }
  | { ok: false; problem: string; matrices?: ModelMatrices };

/** A DOF's name for messages: its label, else its number from 1. */
export function dofName(labels: readonly string[], index: number): string {
  const label = labels[index]?.trim();
  return label ? `${label} (DOF ${index + 1})` : `DOF ${index + 1}`;
}

const isNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);

/** The model's matrices, or the first entry that keeps them from being built. */
export function modelMatrices(input: ModelInput): { matrices: ModelMatrices } | { problem: string } {
  const n = input.entry === 'chain' ? input.massesKg.length : input.massMatrixKg.length;
  if (n === 0) return { problem: 'The model needs at least one degree of freedom.' };
  if (input.entry === 'chain') {
    for (let i = 0; i < n; i++) {
      const mass = input.massesKg[i];
      if (!isNumber(mass) || mass <= 0) return { problem: `Mass m${i + 1} of ${dofName(input.dofLabels, i)} must be a number greater than 0 kg.` };
      const spring = input.springsNPerM[i];
      if (!isNumber(spring) || spring < 0) return { problem: `Spring k${i + 1} must be a number of 0 N/m or more.` };
    }
    return { matrices: chainMatrices(input.massesKg.slice(0, n) as number[], input.springsNPerM.slice(0, n) as number[]) };
  }
  for (const [matrix, what, unit] of [
    [input.massMatrixKg, 'mass matrix', 'kg'],
    [input.stiffnessMatrixNPerM, 'stiffness matrix', 'N/m'],
  ] as const) {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        if (!isNumber(matrix[i]?.[j])) return { problem: `Entry (${i + 1}, ${j + 1}) of the ${what} must be a number in ${unit}.` };
      }
    }
  }
  return {
    matrices: {
      massMatrixKg: input.massMatrixKg.slice(0, n).map((row) => row.slice(0, n) as number[]),
      stiffnessMatrixNPerM: input.stiffnessMatrixNPerM.slice(0, n).map((row) => row.slice(0, n) as number[]),
    },
  };
}

/** The engine's refusal in the words of the form: `massKg` is the mass matrix, entries count from 1. */
export function describeEngineError(error: unknown): string {
  if (!(error instanceof Error)) return 'The modes could not be computed.';
  const message = error.message
    .replace(/^massKg: /, 'The mass matrix ')
    .replace(/^stiffnessNPerM: /, 'The stiffness matrix ')
    .replace(/\((\d+), (\d+)\)/g, (_, i: string, j: string) => `(${Number(i) + 1}, ${Number(j) + 1})`);
  return message.endsWith('.') ? message : `${message}.`;
}

/** Modes of the entered model, or why they cannot be computed yet. */
export function analyseModel(input: ModelInput): ModelAnalysis {
  const built = modelMatrices(input);
  if ('problem' in built) return { ok: false, problem: built.problem };
  try {
    return { ok: true, matrices: built.matrices, modes: solveModes(built.matrices.massMatrixKg, built.matrices.stiffnessMatrixNPerM) };
  } catch (error) {
    if (error instanceof EngineInputError || error instanceof RangeError || error instanceof TypeError) {
      return { ok: false, problem: describeEngineError(error), matrices: built.matrices };
    }
    throw error;
  }
}

/** Samples of a free-vibration plot. */
export const FREE_VIBRATION_SAMPLES = 600;
/** Without a duration given, the plot spans this many periods of the lowest non-rigid mode. */
export const FREE_VIBRATION_PERIODS = 6;

export interface FreeVibrationPlot {
  timesS: Float64Array;
  /** displacementM[dof][t]. */
  displacementM: Float64Array[];
  durationS: number;
}

/** The default plot duration: FREE_VIBRATION_PERIODS periods of the lowest mode with a frequency above 0. */
export function defaultDurationS(modes: ModalSolution): number {
  for (let r = 0; r < modes.dofCount; r++) {
    if (modes.frequencyHz[r] > 0) return FREE_VIBRATION_PERIODS / modes.frequencyHz[r];
  }
  return 10;
}

export function computeFreeVibration(
  matrices: ModelMatrices,
  initialDisplacementM: readonly number[],
  initialVelocityMPerS: readonly number[],
  durationS: number,
): { ok: true; plot: FreeVibrationPlot } | { ok: false; problem: string } {
  const n = matrices.massMatrixKg.length;
  for (let i = 0; i < n; i++) {
    if (!isNumber(initialDisplacementM[i])) return { ok: false, problem: `The initial displacement of DOF ${i + 1} must be a number in m.` };
    if (!isNumber(initialVelocityMPerS[i])) return { ok: false, problem: `The initial velocity of DOF ${i + 1} must be a number in m/s.` };
  }
  if (!isNumber(durationS) || durationS <= 0) return { ok: false, problem: 'The duration must be a number greater than 0 s.' };
  const timesS = sampleTimesS(durationS, FREE_VIBRATION_SAMPLES);
  try {
    const result = solveFreeVibration({
      massKg: matrices.massMatrixKg,
      stiffnessNPerM: matrices.stiffnessMatrixNPerM,
      initialDisplacementM: initialDisplacementM.slice(0, n),
      initialVelocityMPerS: initialVelocityMPerS.slice(0, n),
      timesS,
    });
    const displacementM = Array.from({ length: n }, (_, dof) => {
      const series = new Float64Array(timesS.length);
      for (let t = 0; t < timesS.length; t++) series[t] = result.displacementM[t * n + dof];
      return series;
    });
    return { ok: true, plot: { timesS, displacementM, durationS } };
  } catch (error) {
    return { ok: false, problem: describeEngineError(error) };
  }
}
