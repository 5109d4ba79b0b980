/**
 * Optimum tuning of one TMD on one structure mode. Every damping ratio is referred to the frequency of its own
 * oscillator: ζ_a to the damper's frequency f_a, ζ_s to the structure's f_s. Frequency ratio f = f_a / f_s,
 * mass ratio μ = m / M.
 *
 * Closed forms (see docs/engine.md for the sources):
 *   den-hartog        f = 1/(1+μ),               ζ_a = √(3μ / (8(1+μ)))
 *   warburton-random  f = √(1+μ/2)/(1+μ),        ζ_a = √(μ(1+3μ/4) / (4(1+μ)(1+μ/2)))
 *   ioi-ikeda         f = 1/(1+μ) − (0.241+1.7μ−2.6μ²)ζ_s − (1−1.9μ+μ²)ζ_s²
 *                     ζ_a = √(3μ/(8(1+μ))) + (0.13+0.12μ+0.4μ²)ζ_s − (0.01+0.9μ+3μ²)ζ_s²
 * Numerical:
 *   hinf  minimises max_ω |X_s| K / F (continuous peak search), for any ζ_s
 *   h2    minimises the mean-square structure displacement under a white-noise force on the structure, from the
 *         stationary covariance of the state (Lyapunov equation A P + P Aᵀ + B Bᵀ = 0), for any ζ_s
 */
import { tuningMethods, type TuningMethod, type TuningResult } from './types';
import { EngineInputError, checkDampingRatio, checkPositive, solveLyapunov } from './linalg';
import { GOLDEN_SECTION_FRACTION, brentMaximise } from './peak';
import { createModeTmdSystem, findResponsePeak } from './response';

export { tuningMethods };

export interface TuningRatios {
  frequencyRatio: number;
  tmdDampingRatio: number;
}

const checkMassRatio = (massRatio: number) => checkPositive(massRatio, 'massRatio');
const checkStructureDamping = (structureDampingRatio: number) => checkDampingRatio(structureDampingRatio, 'structureDampingRatio');

/** Den Hartog (Mechanical Vibrations, 4th ed. 1956): harmonic force, undamped primary. */
export function tuneDenHartog(massRatio: number): TuningRatios {
  checkMassRatio(massRatio);
  const mu = massRatio;
  return { frequencyRatio: 1 / (1 + mu), tmdDampingRatio: Math.sqrt((3 * mu) / (8 * (1 + mu))) };
}

/** Warburton (Earthquake Eng. Struct. Dyn. 10, 1982): white-noise force, undamped primary, displacement. */
export function tuneWarburtonRandom(massRatio: number): TuningRatios {
  checkMassRatio(massRatio);
  const mu = massRatio;
  return {
    frequencyRatio: Math.sqrt(1 + mu / 2) / (1 + mu),
    tmdDampingRatio: Math.sqrt((mu * (1 + (3 * mu) / 4)) / (4 * (1 + mu) * (1 + mu / 2))),
  };
}

/** Ioi & Ikeda (1978) curve fit: harmonic force, damped primary. */
export function tuneIoiIkeda(massRatio: number, structureDampingRatio: number): TuningRatios {
  checkMassRatio(massRatio);
  checkStructureDamping(structureDampingRatio);
  const mu = massRatio;
  const z = structureDampingRatio;
  const frequencyRatio = 1 / (1 + mu) - (0.241 + 1.7 * mu - 2.6 * mu * mu) * z - (1 - 1.9 * mu + mu * mu) * z * z;
  const tmdDampingRatio = Math.sqrt((3 * mu) / (8 * (1 + mu))) + (0.13 + 0.12 * mu + 0.4 * mu * mu) * z - (0.01 + 0.9 * mu + 3 * mu * mu) * z * z;
  if (!(frequencyRatio > 0) || !(tmdDampingRatio > 0 && tmdDampingRatio < 1)) {
    throw new EngineInputError(
      'structureDampingRatio',
      `structureDampingRatio: the Ioi–Ikeda fit gives no usable tuning at massRatio ${mu} and structureDampingRatio ${z} (frequency ratio ${frequencyRatio}, damping ratio ${tmdDampingRatio})`,
    );
  }
  return { frequencyRatio, tmdDampingRatio };
}

/**
 * The band searched by peakAmplification, in units of the structure's frequency: from this fraction of the lower of
 * the first coupled frequency and f_s, to this multiple of the higher of the last coupled frequency and f_s. Below
 * the band the amplification is within about 1 % of its static value 1, above it it falls towards 0.
 */
const AMPLIFICATION_BAND_LOW_FACTOR = 0.1;
const AMPLIFICATION_BAND_HIGH_FACTOR = 3;
/**
 * Grid samples of that search: fewer than findResponsePeak's default, because its hints already bracket both
 * coupled resonances and the optimisers call it hundreds of times.
 */
const AMPLIFICATION_GRID_SAMPLES = 12;

/**
 * Peak dynamic amplification max_ω |X_s| K / F of a structure (μ, ζ_s) with one TMD (f, ζ_a), over all ω ≥ 0
 * (the static value 1 at ω = 0 included). Dimensionless; independent of the structure's frequency and mass.
 */
export function peakAmplification(massRatio: number, frequencyRatio: number, tmdDampingRatio: number, structureDampingRatio: number): number {
  // Structure of 1 kg at 1 Hz: K = (2π)² N/m, so |X_s| K / F = |X_s per N| × (2π)².
  const system = createModeTmdSystem(
    { modalMassKg: 1, frequencyHz: 1, dampingRatio: structureDampingRatio },
    [{ massKg: massRatio, frequencyHz: frequencyRatio, dampingRatio: tmdDampingRatio }],
  );
  const low = system.coupledFrequenciesHz[0];
  const high = system.coupledFrequenciesHz[system.coupledFrequenciesHz.length - 1];
  const band: [number, number] = [AMPLIFICATION_BAND_LOW_FACTOR * Math.min(low, 1), AMPLIFICATION_BAND_HIGH_FACTOR * Math.max(high, 1)];
  const peak = findResponsePeak(system, band, { quantity: 'structureDisplacement', samples: AMPLIFICATION_GRID_SAMPLES });
  // Below the band the amplification falls to its static value 1 at ω = 0, which is the answer when no peak rises above it.
  return Math.max(peak.value * system.structureStiffnessNPerM, 1);
}

/**
 * Stationary variance of x_s under a unit-intensity white-noise force (E[w(t) w(t+τ)] = δ(τ)) on a structure of
 * 1 kg at 1 rad/s with the given TMD: P₀₀ of the Lyapunov solution, equal to (1/2π) ∫ |X_s(ω)/F|² dω.
 * Dimensionless in these units; only its minimum over the tuning matters for `h2`.
 */
export function meanSquareAmplification(massRatio: number, frequencyRatio: number, tmdDampingRatio: number, structureDampingRatio: number): number {
  const mu = massRatio;
  const ka = mu * frequencyRatio * frequencyRatio; // ω_s = 1, M = 1
  const ca = 2 * tmdDampingRatio * mu * frequencyRatio;
  const cs = 2 * structureDampingRatio;
  // State z = [x_s, x_a, v_s, v_a]; ż = A z + B w.
  const a = new Float64Array(16);
  a[0 * 4 + 2] = 1;
  a[1 * 4 + 3] = 1;
  a[2 * 4 + 0] = -(1 + ka);
  a[2 * 4 + 1] = ka;
  a[2 * 4 + 2] = -(cs + ca);
  a[2 * 4 + 3] = ca;
  a[3 * 4 + 0] = ka / mu;
  a[3 * 4 + 1] = -ka / mu;
  a[3 * 4 + 2] = ca / mu;
  a[3 * 4 + 3] = -ca / mu;
  const q = new Float64Array(16);
  q[2 * 4 + 2] = 1;
  const p = solveLyapunov(a, q, 4);
  if (!p || !(p[0] > 0)) return Infinity;
  return p[0];
}

/** Iteration cap of one Brent minimisation in the tuning search (it converges in far fewer). */
const MINIMISE_MAX_ITERATIONS = 200;

/** Brent minimisation of a smooth or V-shaped unimodal function on [a, b]. */
function minimise(fn: (x: number) => number, a: number, b: number, relativeTolerance: number): { x: number; value: number } {
  const x0 = a + GOLDEN_SECTION_FRACTION * (b - a);
  const f0 = fn(x0);
  const result = brentMaximise((x) => -fn(x), a, b, x0, -f0, relativeTolerance, 0, MINIMISE_MAX_ITERATIONS);
  return { x: result.x, value: -result.value };
}

/** Damper damping ratios searched: from the lower of this floor and FLOOR_FRACTION × the start's, to the ceiling. */
const SEARCH_DAMPING_RATIO_FLOOR = 1e-4;
const SEARCH_DAMPING_RATIO_FLOOR_FRACTION = 0.05;
const SEARCH_DAMPING_RATIO_CEILING = 0.95;
/** Relative tolerance of the inner search, on ln ζ_a. */
const INNER_RELATIVE_TOLERANCE = 1e-8;
/** The inner search first tries ζ_a within ×/÷ this factor of the last best one. */
const INNER_BRACKET_FACTOR = 1.5;
/** An inner answer this close (× the bracket's width) to an edge of the bracket that is not an edge of the full range
 * is searched again on the full range. */
const INNER_BRACKET_EDGE_FRACTION = 1e-3;
/** Frequency ratios searched: [max(1e-3, LOW × f₀), HIGH × max(f₀, 1/(1+μ))], f₀ the closed-form start. */
const SEARCH_FREQUENCY_RATIO_LOW_FACTOR = 0.3;
const SEARCH_FREQUENCY_RATIO_HIGH_FACTOR = 1.3;

/**
 * Two-level search: for each frequency ratio the best damping ratio (log scale), then the best frequency ratio.
 * The closed-form start is kept when the search does not improve on it (it can only tie at tiny mass ratios,
 * where the optimum is extremely sharp).
 */
function optimise(objective: (frequencyRatio: number, tmdDampingRatio: number) => number, massRatio: number, start: TuningRatios): TuningRatios {
  const logZetaLo = Math.log(Math.min(SEARCH_DAMPING_RATIO_FLOOR, SEARCH_DAMPING_RATIO_FLOOR_FRACTION * start.tmdDampingRatio));
  const logZetaHi = Math.log(SEARCH_DAMPING_RATIO_CEILING);
  const innerTolerance = INNER_RELATIVE_TOLERANCE;
  // The objective's sensitivity to the frequency ratio grows like 1/√μ: tighten the tolerance for small μ.
  const outerTolerance = Math.max(1e-13, Math.min(1e-9, 1e-7 * massRatio));
  let bestZeta = start.tmdDampingRatio;
  // The best damping ratio moves little between neighbouring frequency ratios: search a bracket of ×/÷ 1.5 around the
  // last one first, and the whole range only when the answer lands on that bracket's edge.
  const halfWidth = Math.log(INNER_BRACKET_FACTOR);
  const inner = (f: number) => {
    const centre = Math.log(bestZeta);
    const lo = Math.max(logZetaLo, centre - halfWidth);
    const hi = Math.min(logZetaHi, centre + halfWidth);
    let found = minimise((u) => objective(f, Math.exp(u)), lo, hi, innerTolerance);
    const edge = INNER_BRACKET_EDGE_FRACTION * (hi - lo);
    if ((found.x - lo < edge && lo > logZetaLo) || (hi - found.x < edge && hi < logZetaHi)) {
      found = minimise((u) => objective(f, Math.exp(u)), logZetaLo, logZetaHi, innerTolerance);
    }
    bestZeta = Math.exp(found.x);
    return found.value;
  };
  const fLo = Math.max(1e-3, SEARCH_FREQUENCY_RATIO_LOW_FACTOR * start.frequencyRatio);
  const fHi = SEARCH_FREQUENCY_RATIO_HIGH_FACTOR * Math.max(start.frequencyRatio, 1 / (1 + massRatio));
  const outer = minimise(inner, fLo, fHi, outerTolerance);
  const value = inner(outer.x);
  const found = { frequencyRatio: outer.x, tmdDampingRatio: bestZeta };
  return value <= objective(start.frequencyRatio, start.tmdDampingRatio) ? found : start;
}

/** Numerical H∞ optimum: the tuning with the lowest peak of |X_s| K / F, for any structure damping. */
export function tuneHInfinity(massRatio: number, structureDampingRatio: number): TuningRatios {
  checkMassRatio(massRatio);
  checkStructureDamping(structureDampingRatio);
  if (structureDampingRatio >= Math.SQRT1_2) {
    // |X_s| K / F of the structure alone then never exceeds its static value 1: there is no resonant peak to
    // lower, and many tunings share the minimum, so no optimum is defined.
    throw new EngineInputError(
      'structureDampingRatio',
      `structureDampingRatio: must be below 1/√2 ≈ 0.7071 for hinf tuning (got ${structureDampingRatio}); above it the structure has no resonant peak and the H∞ optimum is not defined`,
    );
  }
  return optimise((f, z) => peakAmplification(massRatio, f, z, structureDampingRatio), massRatio, tuneDenHartog(massRatio));
}

/** Numerical H2 optimum: the tuning with the lowest mean-square structure displacement under white noise. */
export function tuneH2(massRatio: number, structureDampingRatio: number): TuningRatios {
  checkMassRatio(massRatio);
  checkStructureDamping(structureDampingRatio);
  return optimise((f, z) => meanSquareAmplification(massRatio, f, z, structureDampingRatio), massRatio, tuneWarburtonRandom(massRatio));
}

/** Tuning of one TMD by the named method; the peak amplification is that of the tuned system with its ζ_s. */
export function tuneTmd(method: TuningMethod, massRatio: number, structureFrequencyHz: number, structureDampingRatio = 0): TuningResult {
  checkMassRatio(massRatio);
  checkStructureDamping(structureDampingRatio);
  checkPositive(structureFrequencyHz, 'structureFrequencyHz');
  let ratios: TuningRatios;
  switch (method) {
    case 'den-hartog':
      ratios = tuneDenHartog(massRatio);
      break;
    case 'warburton-random':
      ratios = tuneWarburtonRandom(massRatio);
      break;
    case 'ioi-ikeda':
      ratios = tuneIoiIkeda(massRatio, structureDampingRatio);
      break;
    case 'hinf':
      ratios = tuneHInfinity(massRatio, structureDampingRatio);
      break;
    case 'h2':
      ratios = tuneH2(massRatio, structureDampingRatio);
      break;
    default:
      throw new EngineInputError('method', `method: must be one of ${tuningMethods.join(', ')} (got ${String(method)})`);
  }
  return {
    frequencyRatio: ratios.frequencyRatio,
    tmdFrequencyHz: ratios.frequencyRatio * structureFrequencyHz,
    tmdDampingRatio: ratios.tmdDampingRatio,
    peakAmplification: peakAmplification(massRatio, ratios.frequencyRatio, ratios.tmdDampingRatio, structureDampingRatio),
  };
}
