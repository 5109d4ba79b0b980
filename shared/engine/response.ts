/**
 * Damped steady-state response of one structure mode with any number of TMDs attached at the same point
 * (the 1 + n DOF system), under a harmonic modal force F e^{iωt} on the structure.
 *
 * Structure:  (K − ω²M + iωC) X_s + Σ_j (k_j + iωc_j)(X_s − X_j) = F
 * Damper j:   −ω² m_j X_j + (k_j + iωc_j)(X_j − X_s) = 0
 * with K = M ω_s², C = 2 ζ_s M ω_s, k_j = m_j ω_j², c_j = 2 ζ_j m_j ω_j (each ζ referred to its own frequency).
 * Eliminating X_j:  X_s = F / (K − ω²M + iωC − Σ_j ω² m_j (k_j + iωc_j) / (k_j − ω² m_j + iωc_j)),
 * stroke_j = X_j − X_s = ω² m_j X_s / (k_j − ω² m_j + iωc_j).
 * The kernel works on Float64Arrays and allocates nothing per frequency point.
 */
import type { StructureMode, TmdParameters } from './types';
import { checkStructureMode, checkTmdParameters, withPathPrefix } from './input-paths';
import { symmetricEigen } from './symmetric-eigen';
import { maximiseOnInterval } from './peak';

const TWO_PI = 2 * Math.PI;

export interface ModeTmdSystem {
  readonly tmdCount: number;
  readonly structure: Readonly<StructureMode>;
  readonly tmds: readonly Readonly<TmdParameters>[];
  readonly structureMassKg: number;
  readonly structureStiffnessNPerM: number;
  readonly structureDampingNsPerM: number;
  readonly tmdMassKg: Float64Array;
  readonly tmdStiffnessNPerM: Float64Array;
  readonly tmdDampingNsPerM: Float64Array;
  /** Undamped natural frequencies of the coupled 1 + n system, ascending. */
  readonly coupledFrequenciesHz: Float64Array;
  /** Damping ratio of each coupled mode from the undamped mode shapes (φᵀCφ / 2ω): a guide for the peak search. */
  readonly coupledDampingRatios: Float64Array;
  /** True when every damping ratio is zero (the response is unbounded at each coupled frequency). */
  readonly undamped: boolean;
}

/** Magnitudes of the steady-state response per 1 N of modal force. */
export interface ModeTmdPoint {
  structureDisplacementMPerN: number;
  structureAccelerationMPerS2PerN: number;
  /** |X_j − X_s| per 1 N, one per damper. */
  tmdStrokeMPerN: Float64Array;
}

export type ResponseQuantity = 'structureAcceleration' | 'structureDisplacement' | 'tmdStroke';

export interface ResponsePeakOptions {
  quantity?: ResponseQuantity;
  /** Which damper's stroke, for quantity 'tmdStroke' (default 0). */
  tmdIndex?: number;
  /** Force amplitude in N at a frequency (default 1 N); the value searched is magnitude × weight. */
  forceWeight?: (frequencyHz: number) => number;
  /** Relative tolerance on the peak frequency (default DEFAULT_RELATIVE_TOLERANCE of peak.ts, 1e-7). */
  relativeTolerance?: number;
  /** Grid samples on the band (default DEFAULT_SAMPLES of peak.ts, 32), merged with points around every coupled natural frequency. */
  samples?: number;
}

/**
 * Extra samples of the peak search around each coupled natural frequency f_r: f_r (1 ± offset × ζ_r) for each offset,
 * ζ_r the coupled mode's damping estimate. A resonance's half-power width is about 2 ζ_r f_r, so these bracket it.
 */
const RESONANCE_HINT_OFFSETS = [0.4, 1, 2] as const;
/** ζ_r used for the hints is held in [floor, ceiling]: an undamped mode still gets distinct points, a heavily damped one stays near f_r. */
const HINT_DAMPING_RATIO_FLOOR = 1e-6;
const HINT_DAMPING_RATIO_CEILING = 0.3;

/** Checks the parameters and precomputes stiffnesses, dampings and the coupled natural frequencies. */
export function createModeTmdSystem(structure: StructureMode, tmds: readonly TmdParameters[]): ModeTmdSystem {
  if (structure === null || typeof structure !== 'object') throw new TypeError('structure: must be an object');
  if (!Array.isArray(tmds)) throw new TypeError('tmds: must be an array');
  withPathPrefix('structure', () => checkStructureMode(structure));
  const n = tmds.length;
  const tmdMassKg = new Float64Array(n);
  const tmdStiffnessNPerM = new Float64Array(n);
  const tmdDampingNsPerM = new Float64Array(n);
  let undamped = structure.dampingRatio === 0;
  for (let j = 0; j < n; j++) {
    const tmd = tmds[j];
    if (tmd === null || typeof tmd !== 'object') throw new TypeError(`tmds.${j}: must be an object`);
    withPathPrefix(`tmds.${j}`, () => checkTmdParameters(tmd));
    const omega = TWO_PI * tmd.frequencyHz;
    tmdMassKg[j] = tmd.massKg;
    tmdStiffnessNPerM[j] = tmd.massKg * (omega * omega);
    tmdDampingNsPerM[j] = 2 * tmd.dampingRatio * tmd.massKg * omega;
    if (tmd.dampingRatio !== 0) undamped = false;
  }
  const omegaS = TWO_PI * structure.frequencyHz;
  const structureMassKg = structure.modalMassKg;
  const structureStiffnessNPerM = structureMassKg * (omegaS * omegaS);
  const structureDampingNsPerM = 2 * structure.dampingRatio * structureMassKg * omegaS;

  // Undamped coupled modes: eigenproblem of M^{-1/2} K M^{-1/2} (absolute coordinates, DOF 0 = structure).
  const size = n + 1;
  const a = new Float64Array(size * size);
  let kTotal = structureStiffnessNPerM;
  for (let j = 0; j < n; j++) kTotal += tmdStiffnessNPerM[j];
  a[0] = kTotal / structureMassKg;
  for (let j = 0; j < n; j++) {
    const off = -tmdStiffnessNPerM[j] / Math.sqrt(structureMassKg * tmdMassKg[j]);
    a[j + 1] = off;
    a[(j + 1) * size] = off;
    a[(j + 1) * size + j + 1] = tmdStiffnessNPerM[j] / tmdMassKg[j];
  }
  const { values, vectors } = symmetricEigen(a, size); // ascending; row r = eigenvector r
  const coupledFrequenciesHz = new Float64Array(size);
  const coupledDampingRatios = new Float64Array(size);
  const rootStructureMass = Math.sqrt(structureMassKg);
  for (let r = 0; r < size; r++) {
    const omega = Math.sqrt(Math.max(values[r], 0));
    coupledFrequenciesHz[r] = omega / TWO_PI;
    // Mass-normalised shape φ = M^{-1/2} y; modal damping φᵀ C φ.
    const phi0 = vectors[r * size] / rootStructureMass;
    let modalDamping = structureDampingNsPerM * phi0 * phi0;
    for (let j = 0; j < n; j++) {
      const relative = vectors[r * size + j + 1] / Math.sqrt(tmdMassKg[j]) - phi0;
      modalDamping += tmdDampingNsPerM[j] * relative * relative;
    }
    coupledDampingRatios[r] = omega > 0 ? modalDamping / (2 * omega) : 0;
  }
  const tmdCopies: TmdParameters[] = new Array(n);
  for (let j = 0; j < n; j++) {
    tmdCopies[j] = { massKg: tmds[j].massKg, frequencyHz: tmds[j].frequencyHz, dampingRatio: tmds[j].dampingRatio };
  }
  return {
    tmdCount: n,
    structure: { modalMassKg: structure.modalMassKg, frequencyHz: structure.frequencyHz, dampingRatio: structure.dampingRatio },
    tmds: tmdCopies,
    structureMassKg,
    structureStiffnessNPerM,
    structureDampingNsPerM,
    tmdMassKg,
    tmdStiffnessNPerM,
    tmdDampingNsPerM,
    coupledFrequenciesHz,
    coupledDampingRatios,
    undamped,
  };
}

export function createModeTmdPoint(system: ModeTmdSystem): ModeTmdPoint {
  return {
    structureDisplacementMPerN: 0,
    structureAccelerationMPerS2PerN: 0,
    tmdStrokeMPerN: new Float64Array(system.tmdCount),
  };
}

/**
 * The dynamic stiffness the structure sees at ω (the denominator of X_s / F in the module comment),
 *   D = K − ω²M + iωC − Σ_j ω² m_j (k_j + iωc_j) / (k_j − ω² m_j + iωc_j),
 * written to out[0] (real part) and out[1] (imaginary part). A damper whose own dynamic stiffness
 * k_j − ω² m_j + iωc_j is exactly zero (undamped, at its own frequency) makes D infinite: its term is left out and
 * counted in the returned number of such dampers.
 */
function structureDynamicStiffness(system: ModeTmdSystem, omega: number, out: Float64Array): number {
  const omega2 = omega * omega;
  const masses = system.tmdMassKg;
  const stiffnesses = system.tmdStiffnessNPerM;
  const dampings = system.tmdDampingNsPerM;
  let dRe = system.structureStiffnessNPerM - omega2 * system.structureMassKg;
  let dIm = omega * system.structureDampingNsPerM;
  let singular = 0;
  for (let j = 0; j < system.tmdCount; j++) {
    const inertia = masses[j] * omega2;
    const denRe = stiffnesses[j] - inertia;
    const denIm = omega * dampings[j];
    const den2 = denRe * denRe + denIm * denIm;
    if (den2 === 0) {
      singular++;
      continue;
    }
    // − inertia (k_j + iωc_j) / den
    const scale = -inertia / den2;
    dRe += scale * (stiffnesses[j] * denRe + denIm * denIm);
    dIm += scale * (denIm * denRe - stiffnesses[j] * denIm);
  }
  out[0] = dRe;
  out[1] = dIm;
  return singular;
}

/** Scratch for the dynamic stiffness in evaluateModeTmdSystem (no allocation per frequency point). */
const dynamicStiffnessScratch = new Float64Array(2);

/**
 * |acceleration| of the structure per 1 N at one frequency, the same value as
 * `evaluateModeTmdSystem(...).structureAccelerationMPerS2PerN` without the strokes: for peak searches of the
 * structure's response, where the strokes are not needed. Allocates nothing.
 */
export function evaluateStructureAccelerationPerN(system: ModeTmdSystem, frequencyHz: number): number {
  const omega = TWO_PI * frequencyHz;
  const d = dynamicStiffnessScratch;
  if (structureDynamicStiffness(system, omega, d) > 0) return 0;
  const xs = 1 / Math.sqrt(d[0] * d[0] + d[1] * d[1]);
  return omega * omega * xs;
}

/**
 * Response magnitudes per 1 N at one frequency, written into `out` (no allocation). At an exact pole of an
 * undamped system the magnitudes are Infinity; at the exact own frequency of an undamped damper the structure
 * stands still and that damper's stroke carries the force (shared equally if several are singular there).
 */
export function evaluateModeTmdSystem(system: ModeTmdSystem, frequencyHz: number, out: ModeTmdPoint): ModeTmdPoint {
  const omega = TWO_PI * frequencyHz;
  const omega2 = omega * omega;
  const n = system.tmdCount;
  const masses = system.tmdMassKg;
  const stiffnesses = system.tmdStiffnessNPerM;
  const dampings = system.tmdDampingNsPerM;
  const strokes = out.tmdStrokeMPerN;
  const d = dynamicStiffnessScratch;
  const singular = structureDynamicStiffness(system, omega, d);
  if (singular > 0) {
    out.structureDisplacementMPerN = 0;
    out.structureAccelerationMPerS2PerN = 0;
    for (let j = 0; j < n; j++) {
      const denRe = stiffnesses[j] - masses[j] * omega2;
      const denIm = omega * dampings[j];
      strokes[j] = denRe * denRe + denIm * denIm === 0 ? 1 / (singular * Math.hypot(stiffnesses[j], denIm)) : 0;
    }
    return out;
  }
  const xs = 1 / Math.sqrt(d[0] * d[0] + d[1] * d[1]);
  out.structureDisplacementMPerN = xs;
  out.structureAccelerationMPerS2PerN = omega2 * xs;
  for (let j = 0; j < n; j++) {
    const denRe = stiffnesses[j] - masses[j] * omega2;
    const denIm = omega * dampings[j];
    strokes[j] = (masses[j] * omega2 * xs) / Math.sqrt(denRe * denRe + denIm * denIm);
  }
  return out;
}

/**
 * Complex structure displacement X_s = 1 / D per 1 N at one frequency (re, im written to `out[0]`, `out[1]`);
 * 0 at the exact own frequency of an undamped damper. Phase convention: x(t) = Re(X e^{iωt}).
 */
export function evaluateStructureReceptance(system: ModeTmdSystem, frequencyHz: number, out: Float64Array): Float64Array {
  if (structureDynamicStiffness(system, TWO_PI * frequencyHz, out) > 0) {
    out[0] = 0;
    out[1] = 0;
    return out;
  }
  const dRe = out[0];
  const dIm = out[1];
  const d2 = dRe * dRe + dIm * dIm;
  out[0] = dRe / d2;
  out[1] = -dIm / d2;
  return out;
}

function quantityOf(point: ModeTmdPoint, quantity: ResponseQuantity, tmdIndex: number): number {
  if (quantity === 'structureAcceleration') return point.structureAccelerationMPerS2PerN;
  if (quantity === 'structureDisplacement') return point.structureDisplacementMPerN;
  return point.tmdStrokeMPerN[tmdIndex];
}

/**
 * The continuous maximum over the closed band of a response quantity (per 1 N, times `forceWeight` when given).
 * Besides a log-spaced grid, the search samples points around each undamped coupled natural frequency, spaced by
 * that mode's damping ratio, so that narrow resonances and the two close peaks of a tuned system are bracketed;
 * each bracketed maximum is then polished by Brent's method. For an undamped system with a natural frequency in
 * the band the answer is { frequencyHz: that frequency, value: Infinity }.
 */
export function findResponsePeak(
  system: ModeTmdSystem,
  bandHz: readonly [number, number],
  options: ResponsePeakOptions = {},
): { frequencyHz: number; value: number } {
  const lo = bandHz[0];
  const hi = bandHz[1];
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(lo > 0) || hi < lo) {
    throw new RangeError(`bandHz: must be [lo, hi] with 0 < lo ≤ hi, finite (got [${lo}, ${hi}])`);
  }
  const quantity = options.quantity ?? 'structureAcceleration';
  if (quantity !== 'structureAcceleration' && quantity !== 'structureDisplacement' && quantity !== 'tmdStroke') {
    throw new RangeError(`quantity: must be structureAcceleration, structureDisplacement or tmdStroke (got ${String(quantity)})`);
  }
  const tmdIndex = options.tmdIndex ?? 0;
  if (quantity === 'tmdStroke' && !(Number.isInteger(tmdIndex) && tmdIndex >= 0 && tmdIndex < system.tmdCount)) {
    throw new RangeError(`tmdIndex: must be an integer in [0, ${system.tmdCount - 1}] (got ${tmdIndex})`);
  }
  const weight = options.forceWeight;
  const point = createModeTmdPoint(system);
  const frequencies = system.coupledFrequenciesHz;
  if (system.undamped) {
    for (let r = 0; r < frequencies.length; r++) {
      if (frequencies[r] >= lo && frequencies[r] <= hi && (weight === undefined || weight(frequencies[r]) !== 0)) {
        return { frequencyHz: frequencies[r], value: Infinity };
      }
    }
  }
  const hints: number[] = [];
  for (let r = 0; r < frequencies.length; r++) {
    const f = frequencies[r];
    if (!(f > 0)) continue;
    const width = Math.min(Math.max(system.coupledDampingRatios[r], HINT_DAMPING_RATIO_FLOOR), HINT_DAMPING_RATIO_CEILING);
    hints.push(f);
    for (const offset of RESONANCE_HINT_OFFSETS) hints.push(f * (1 - offset * width), f * (1 + offset * width));
  }
  hints.push(system.structure.frequencyHz);
  for (const tmd of system.tmds) hints.push(tmd.frequencyHz);
  const fn = weight
    ? (f: number) => {
        const w = weight(f);
        if (w === 0) return 0;
        return quantityOf(evaluateModeTmdSystem(system, f, point), quantity, tmdIndex) * w;
      }
    : (f: number) => quantityOf(evaluateModeTmdSystem(system, f, point), quantity, tmdIndex);
  const result = maximiseOnInterval(fn, lo, hi, { samples: options.samples, relativeTolerance: options.relativeTolerance, hints });
  return { frequencyHz: result.x, value: result.value };
}
