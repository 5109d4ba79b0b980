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
import { buildModeTmdMatrices } from './matrices';
import { integrateNewmark } from './newmark';
import { bachmannAmmannBodyWeightN, findGaitLoadModel, type Gait } from './loads/walking-harmonics';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem } from './response';
import { unboundedResonanceHz } from './loads/response-envelope';
import { LoadCaseError } from './loads/load-envelope';

export interface MovingWalkerInput {
  spanM: number;
  gait?: Gait;
  pacingFrequencyHz?: number;
  walkingSpeedMPerS?: number;
  bodyWeightN?: number;
  timeStepS?: number;
  trailingTimeS?: number;
}

export interface MovingWalkerHistory {
  timeStepS: number;
  timesS: number[];
  structureAccelerationMPerS2: number[];
  runningRms1sMPerS2: number[];
  peakAccelerationMPerS2: number;
  maxRunningRms1sMPerS2: number;
  /** Largest |x_j − x_s| of each damper over the history, m. */
  maxTmdStrokeM: number[];
  /**
   * Steady state of the governing harmonic at the antinode; null when it is unbounded (no damping anywhere and the
   * harmonic at a natural frequency). The time history of one crossing stays finite either way.
   */
  steadyStatePeakAccelerationMPerS2: number | null;
  /** Force amplitude α_h G of the harmonic that governs the steady state, N. */
  governingHarmonicForceN: number;
  /** Force frequency of that harmonic, h × f_p, Hz. */
  governingHarmonicFrequencyHz: number;
  /** Structure frequencies the gait's harmonics cover, Hz. */
  modelRangeHz: [number, number];
  pacingFrequencyHz: number;
  walkingSpeedMPerS: number;
  crossingTimeS: number;
}

export const strideLengthM: Readonly<Record<Gait, number>> = { walking: 0.75, jogging: 1.25 };
const maxSteps = 400_000;

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
  const timeStepS = input.timeStepS ?? 1 / (40 * highestFrequencyHz);
  const stepCount = Math.ceil((crossingTimeS + trailingTimeS) / timeStepS);
  if (stepCount > maxSteps) {
    throw new LoadCaseError('loadCase.spanM', `the crossing needs ${stepCount} time steps, more than ${maxSteps}: shorten the span or lengthen timeStepS`);
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
