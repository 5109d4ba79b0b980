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
  const fp = input.pacingFrequencyHz ?? resonantPacingFrequencyHz(gait, structure.frequencyHz);
  const v = input.walkingSpeedMPerS ?? strideLengthM[gait] * fp;
  const weight = input.bodyWeightN ?? bachmannAmmannBodyWeightN;
  const L = input.spanM;
  const crossing = L / v;
  const trailing = input.trailingTimeS ?? 0;
  const system = createModeTmdSystem(structure, tmds);
  const fMax = Math.max(...system.coupledFrequenciesHz, ...model.harmonics.map((h) => h.frequencyMultiple * fp));
  const dt = input.timeStepS ?? 1 / (40 * fMax);
  const stepCount = Math.ceil((crossing + trailing) / dt);
  if (stepCount > maxSteps) {
    throw new LoadCaseError('loadCase.spanM', `the crossing needs ${stepCount} time steps, more than ${maxSteps}: shorten the span or lengthen timeStepS`);
  }
  const harmonics = model.harmonics;
  const omegaP = 2 * Math.PI * fp;
  const matrices = buildModeTmdMatrices(structure, tmds);
  const history = integrateNewmark({
    ...matrices,
    timeStepS: dt,
    stepCount,
    force: (t, out) => {
      out.fill(0);
      if (t > crossing) return;
      let f = 0;
      for (let h = 0; h < harmonics.length; h++) f += harmonics[h].dynamicLoadFactor * Math.sin(harmonics[h].frequencyMultiple * omegaP * t);
      out[0] = weight * f * Math.sin((Math.PI * v * t) / L);
    },
  });
  const n = matrices.dofCount;
  const count = stepCount + 1;
  const times: number[] = new Array(count);
  const acc: number[] = new Array(count);
  const rms: number[] = new Array(count);
  const window = Math.max(1, Math.round(1 / dt));
  let sum = 0;
  let peak = 0;
  let maxRms = 0;
  for (let i = 0; i < count; i++) {
    const a = history.accelerationMPerS2[i * n];
    times[i] = history.timesS[i];
    acc[i] = a;
    sum += a * a;
    if (i >= window) {
      const old = acc[i - window];
      sum -= old * old;
    }
    const r = Math.sqrt(Math.max(sum, 0) / window);
    rms[i] = r;
    if (Math.abs(a) > peak) peak = Math.abs(a);
    if (r > maxRms) maxRms = r;
  }
  const maxStroke = tmds.map(() => 0);
  for (let i = 0; i < count; i++) {
    const xs = history.displacementM[i * n];
    for (let j = 0; j < tmds.length; j++) {
      const d = Math.abs(history.displacementM[i * n + j + 1] - xs);
      if (d > maxStroke[j]) maxStroke[j] = d;
    }
  }
  const point = createModeTmdPoint(system);
  let steady: number | null = 0;
  let governingForce = 0;
  let governingFrequency = fp;
  for (const h of harmonics) {
    const f = h.frequencyMultiple * fp;
    const force = h.dynamicLoadFactor * weight;
    if (unboundedResonanceHz(system, [{ loHz: f, hiHz: f, forceN: () => force, label: 'harmonic' }])) {
      // Undamped and in resonance: the steady state grows without limit (the crossing itself stays finite).
      steady = null;
      governingForce = force;
      governingFrequency = f;
      break;
    }
    const a = evaluateModeTmdSystem(system, f, point).structureAccelerationMPerS2PerN * force;
    if (a > steady) {
      steady = a;
      governingForce = h.dynamicLoadFactor * weight;
      governingFrequency = f;
    }
  }
  const multiples = harmonics.map((h) => h.frequencyMultiple);
  const modelRange: [number, number] = [Math.min(...multiples) * model.pacingRangeHz[0], Math.max(...multiples) * model.pacingRangeHz[1]];
  return {
    timeStepS: dt,
    timesS: times,
    structureAccelerationMPerS2: acc,
    runningRms1sMPerS2: rms,
    peakAccelerationMPerS2: peak,
    maxRunningRms1sMPerS2: maxRms,
    maxTmdStrokeM: maxStroke,
    steadyStatePeakAccelerationMPerS2: steady,
    governingHarmonicForceN: governingForce,
    governingHarmonicFrequencyHz: governingFrequency,
    modelRangeHz: modelRange,
    pacingFrequencyHz: fp,
    walkingSpeedMPerS: v,
    crossingTimeS: crossing,
  };
}
