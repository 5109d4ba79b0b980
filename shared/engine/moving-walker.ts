/**
 * One person walking (or jogging) across a simply supported span: a time history of the structure mode (with its
 * dampers) under the force moving along the unit-max half-sine mode shape,
 *   F(t) = sin(π v t / L) · G Σ_h α_h sin(2π h f_p t)   for 0 ≤ t ≤ L / v, then free decay,
 * with the Bachmann & Ammann (1987) dynamic load factors α_h (the static part G is left out: it moves too slowly to
 * cause acceleration). Integrated by the engine's Newmark average-acceleration scheme; the answer gives the peak
 * acceleration and the 1-s running r.m.s. (the quantity comfort guides quote for a transient), and the steady
 * state of the resonant harmonic at the antinode, which the time history approaches on a long span.
 * Walking speed default: stride 0.75 m walking, 1.25 m jogging (v = stride × f_p; common practice, our choice).
 */

import type { StructureMode, TmdParameters } from './types';
import type { AssessResponse, MovingWalkerLoadCase } from '../contracts/compute-design';
import { buildModeTmdMatrices } from './matrices';
import { integrateNewmark } from './newmark';
import { bachmannAmmannBodyWeightN, findGaitLoadModel, type Gait } from './loads/walking-harmonics';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem } from './response';
import { unboundedResonanceHz } from './loads/response-envelope';
import { LoadCaseError } from './loads/load-envelope';

/** The moving-walker load case without its `kind`: the type of its contract (compute-design.ts). */
export type MovingWalkerInput = Omit<MovingWalkerLoadCase, 'kind'>;

/**
 * The time history of one crossing: the answer's `timeHistory` without the bare structure's figures, the type of its
 * contract (compute-design.ts). `steadyStatePeakAccelerationMPerS2` is null when the steady state of the governing
 * harmonic is unbounded (no damping anywhere and the harmonic at a natural frequency); the crossing stays finite.
 */
export type MovingWalkerHistory = Omit<
  NonNullable<AssessResponse['timeHistory']>,
  'bareStructurePeakAccelerationMPerS2' | 'bareStructureMaxRunningRms1sMPerS2'
>;

export const strideLengthM: Readonly<Record<Gait, number>> = { walking: 0.75, jogging: 1.25 };
/** Most time steps of one crossing: the answer carries three values a step (times, acceleration, r.m.s.), under 20 MB. */
export const MAX_WALKER_STEPS = 300_000;
/**
 * Largest time steps × (1 + dampers)² of one crossing: each Newmark step costs about (1 + dampers)² operations; about
 * 1.5 s on the development machine at the limit (see docs/engine.md, "Limits of work").
 */
export const MAX_WALKER_WORK = 200_000_000;
/** Fewest time steps per period of the fastest motion (a coupled natural frequency or a harmonic of the pace). */
export const MIN_STEPS_PER_PERIOD = 20;
/** Steps per period of the fastest motion when no time step is given. */
export const DEFAULT_STEPS_PER_PERIOD = 40;

/** The pacing frequency that puts a harmonic of the gait on the structure frequency (lowest harmonic first). */
export function resonantPacingFrequencyHz(gait: Gait, structureFrequencyHz: number): number {
  const model = findGaitLoadModel(gait, 'vertical');
  if (!model) throw new LoadCaseError('loadCase.gait', `no vertical load model for ${gait}`);
  const [lo, hi] = model.pacingRangeHz;
  for (const h of model.harmonics) {
    const fp = structureFrequencyHz / h.frequencyMultiple;
    if (fp >= lo && fp <= hi) return fp;
  }
  return Math.min(Math.max(structureFrequencyHz, lo), hi);
}

/** Peak and 1-s running r.m.s. of the structure's acceleration under one crossing. */
export function simulateMovingWalker(structure: StructureMode, tmds: readonly TmdParameters[], input: MovingWalkerInput): MovingWalkerHistory {
  const gait = input.gait ?? 'walking';
  const model = findGaitLoadModel(gait, 'vertical');
  if (!model) throw new LoadCaseError('loadCase.gait', `no vertical load model for ${gait}`);
  const pacingFrequencyHz = input.pacingFrequencyHz ?? resonantPacingFrequencyHz(gait, structure.frequencyHz);
  const speedMPerS = input.walkingSpeedMPerS ?? strideLengthM[gait] * pacingFrequencyHz;
  const bodyWeightN = input.bodyWeightN ?? bachmannAmmannBodyWeightN;
  const spanM = input.spanM;
  const crossingTimeS = spanM / speedMPerS;
  const trailingTimeS = input.trailingTimeS ?? 0;
  const system = createModeTmdSystem(structure, tmds);
  const highestFrequencyHz = Math.max(...system.coupledFrequenciesHz, ...model.harmonics.map((h) => h.frequencyMultiple * pacingFrequencyHz));
  const coarsestStepS = 1 / (MIN_STEPS_PER_PERIOD * highestFrequencyHz);
  if (input.timeStepS !== undefined && !(input.timeStepS <= coarsestStepS)) {
    throw new LoadCaseError(
      'loadCase.timeStepS',
      `must be finer than the motion: at most 1/(${MIN_STEPS_PER_PERIOD} × ${highestFrequencyHz.toPrecision(4)} Hz) = ${coarsestStepS.toPrecision(3)} s, ${MIN_STEPS_PER_PERIOD} steps per period of the highest frequency involved (a coupled natural frequency or a harmonic of the pace; got ${input.timeStepS} s)`,
    );
  }
  const timeStepS = input.timeStepS ?? 1 / (DEFAULT_STEPS_PER_PERIOD * highestFrequencyHz);
  const stepCount = Math.ceil((crossingTimeS + trailingTimeS) / timeStepS);
  if (!(stepCount <= MAX_WALKER_STEPS)) {
    throw new LoadCaseError(
      input.timeStepS !== undefined ? 'loadCase.timeStepS' : trailingTimeS > crossingTimeS ? 'loadCase.trailingTimeS' : 'loadCase.spanM',
      `the crossing (${crossingTimeS.toPrecision(4)} s at ${speedMPerS.toPrecision(3)} m/s, plus ${trailingTimeS} s after it) needs ${stepCount} time steps of ${timeStepS.toPrecision(3)} s, more than ${MAX_WALKER_STEPS.toLocaleString('en-GB')}: shorten the span or the trailing time, or lengthen timeStepS`,
    );
  }
  const dofCount = 1 + tmds.length;
  if (stepCount * dofCount * dofCount > MAX_WALKER_WORK) {
    throw new LoadCaseError(
      'tmds',
      `time steps × (1 + dampers)² must be at most ${MAX_WALKER_WORK.toLocaleString('en-GB')} (got ${stepCount} × ${dofCount}² = ${(stepCount * dofCount * dofCount).toLocaleString('en-GB')}): use fewer dampers (equal dampers can be lumped into one) or a shorter span`,
    );
  }
  const harmonics = model.harmonics;
  const pacingRadPerS = 2 * Math.PI * pacingFrequencyHz;
  const matrices = buildModeTmdMatrices(structure, tmds);
  const history = integrateNewmark({
    ...matrices,
    timeStepS,
    stepCount,
    force: (t, out) => {
      out.fill(0);
      if (t > crossingTimeS) return;
      let f = 0;
      for (let h = 0; h < harmonics.length; h++) f += harmonics[h].dynamicLoadFactor * Math.sin(harmonics[h].frequencyMultiple * pacingRadPerS * t);
      out[0] = bodyWeightN * f * Math.sin((Math.PI * speedMPerS * t) / spanM);
    },
  });
  const n = matrices.dofCount;
  const count = stepCount + 1;
  const times: number[] = new Array(count);
  const acc: number[] = new Array(count);
  const rms: number[] = new Array(count);
  const windowSteps = Math.max(1, Math.round(1 / timeStepS));
  let sum = 0;
  let peak = 0;
  let maxRms = 0;
  for (let i = 0; i < count; i++) {
    const a = history.accelerationMPerS2[i * n];
    times[i] = history.timesS[i];
    acc[i] = a;
    sum += a * a;
    if (i >= windowSteps) {
      const old = acc[i - windowSteps];
      sum -= old * old;
    }
    const r = Math.sqrt(Math.max(sum, 0) / windowSteps);
    rms[i] = r;
    if (Math.abs(a) > peak) peak = Math.abs(a);
    if (r > maxRms) maxRms = r;
  }
  const maxStrokeM = tmds.map(() => 0);
  for (let i = 0; i < count; i++) {
    const xs = history.displacementM[i * n];
    for (let j = 0; j < tmds.length; j++) {
      const d = Math.abs(history.displacementM[i * n + j + 1] - xs);
      if (d > maxStrokeM[j]) maxStrokeM[j] = d;
    }
  }
  const point = createModeTmdPoint(system);
  let steadyMPerS2: number | null = 0;
  let governingForceN = 0;
  let governingFrequencyHz = pacingFrequencyHz;
  for (const h of harmonics) {
    const f = h.frequencyMultiple * pacingFrequencyHz;
    const force = h.dynamicLoadFactor * bodyWeightN;
    if (unboundedResonanceHz(system, [{ loHz: f, hiHz: f, forceN: () => force, label: 'harmonic' }])) {
      // Undamped and in resonance: the steady state grows without limit (the crossing itself stays finite).
      steadyMPerS2 = null;
      governingForceN = force;
      governingFrequencyHz = f;
      break;
    }
    const a = evaluateModeTmdSystem(system, f, point).structureAccelerationMPerS2PerN * force;
    if (a > steadyMPerS2) {
      steadyMPerS2 = a;
      governingForceN = h.dynamicLoadFactor * bodyWeightN;
      governingFrequencyHz = f;
    }
  }
  const multiples = harmonics.map((h) => h.frequencyMultiple);
  const modelRange: [number, number] = [Math.min(...multiples) * model.pacingRangeHz[0], Math.max(...multiples) * model.pacingRangeHz[1]];
  return {
    timeStepS,
    timesS: times,
    structureAccelerationMPerS2: acc,
    runningRms1sMPerS2: rms,
    peakAccelerationMPerS2: peak,
    maxRunningRms1sMPerS2: maxRms,
    maxTmdStrokeM: maxStrokeM,
    steadyStatePeakAccelerationMPerS2: steadyMPerS2,
    governingHarmonicForceN: governingForceN,
    governingHarmonicFrequencyHz: governingFrequencyHz,
    modelRangeHz: modelRange,
    pacingFrequencyHz,
    walkingSpeedMPerS: speedMPerS,
    crossingTimeS,
  };
}
