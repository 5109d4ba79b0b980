/**
 * The envelope of a pedestrian load over its force-frequency bands, and a fast continuous peak search of the
 * response of one structure mode with any number of TMDs attached at the same point (1 + n DOF).
 *
 * Receptance of the structure DOF (PRODUCT conventions, c_j = 2 ζ_j m_j ω_j, k_j = m_j ω_j²):
 *   X_s / F = 1 / (K − ω² M + i ω C + Σ_j Z_j),   Z_j = −ω² m_j (k_j + i ω c_j) / (k_j − ω² m_j + i ω c_j)
 * and each damper's stroke (relative displacement) |x_j − x_s| = |X_s| ω² m_j / |k_j − ω² m_j + i ω c_j|.
 * Evaluations allocate nothing; the peak search samples each band on a uniform grid plus hints (the coupled
 * system's undamped natural frequencies, the kinks of the load's force weight), then refines every local maximum
 * by golden-section search, so it finds the true continuous maximum, not the largest sample.
 */

import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { StructureMode, TmdParameters } from '../types';

/** Flat coefficients of a mode + dampers system, ready for fast evaluation. */
export interface ModeTmdKernel {
  structureMassKg: number;
  structureStiffnessNPerM: number;
  structureDampingNsPerM: number;
  tmdCount: number;
  tmdMassKg: Float64Array;
  tmdStiffnessNPerM: Float64Array;
  tmdDampingNsPerM: Float64Array;
}

function checkPositive(name: string, value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`${name} must be a finite number > 0, got ${value}`);
}
function checkDampingRatio(name: string, value: number): void {
  if (!(value >= 0 && value < 1)) throw new RangeError(`${name} must be in [0, 1), got ${value}`);
}

export function createModeTmdKernel(structure: StructureMode, tmds: readonly TmdParameters[]): ModeTmdKernel {
  checkPositive('structure.modalMassKg', structure.modalMassKg);
  checkPositive('structure.frequencyHz', structure.frequencyHz);
  checkDampingRatio('structure.dampingRatio', structure.dampingRatio);
  const omegaS = 2 * Math.PI * structure.frequencyHz;
  const n = tmds.length;
  const kernel: ModeTmdKernel = {
    structureMassKg: structure.modalMassKg,
    structureStiffnessNPerM: structure.modalMassKg * omegaS * omegaS,
    structureDampingNsPerM: 2 * structure.dampingRatio * structure.modalMassKg * omegaS,
    tmdCount: n,
    tmdMassKg: new Float64Array(n),
    tmdStiffnessNPerM: new Float64Array(n),
    tmdDampingNsPerM: new Float64Array(n),
  };
  for (let j = 0; j < n; j++) {
    const t = tmds[j];
    checkPositive(`tmds.${j}.massKg`, t.massKg);
    checkPositive(`tmds.${j}.frequencyHz`, t.frequencyHz);
    checkDampingRatio(`tmds.${j}.dampingRatio`, t.dampingRatio);
    const w = 2 * Math.PI * t.frequencyHz;
    kernel.tmdMassKg[j] = t.massKg;
    kernel.tmdStiffnessNPerM[j] = t.massKg * w * w;
    kernel.tmdDampingNsPerM[j] = 2 * t.dampingRatio * t.massKg * w;
  }
  return kernel;
}

/** |X_s| per newton at a forcing frequency, m/N. */
export function structureDisplacementPerN(kernel: ModeTmdKernel, frequencyHz: number): number {
  const w = 2 * Math.PI * frequencyHz;
  const w2 = w * w;
  let re = kernel.structureStiffnessNPerM - w2 * kernel.structureMassKg;
  let im = w * kernel.structureDampingNsPerM;
  const n = kernel.tmdCount;
  for (let j = 0; j < n; j++) {
    const m = kernel.tmdMassKg[j];
    const k = kernel.tmdStiffnessNPerM[j];
    const cw = w * kernel.tmdDampingNsPerM[j];
    const dRe = k - w2 * m;
    const dIm = cw;
    const inv = 1 / (dRe * dRe + dIm * dIm);
    // Z = −w² m (k + i cw) / (dRe + i dIm)
    const nRe = -w2 * m * k;
    const nIm = -w2 * m * cw;
    re += (nRe * dRe + nIm * dIm) * inv;
    im += (nIm * dRe - nRe * dIm) * inv;
  }
  const magnitude2 = re * re + im * im;
  // NaN only from 0 × ∞ at the exact own frequency of an undamped damper, whose impedance is infinite there: the
  // structure stands still (checked once here, outside the loop, to keep the hot path lean).
  return magnitude2 === magnitude2 ? 1 / Math.sqrt(magnitude2) : 0;
}

/** |a_s| per newton, (m/s²)/N. */
export function structureAccelerationPerN(kernel: ModeTmdKernel, frequencyHz: number): number {
  const w = 2 * Math.PI * frequencyHz;
  return w * w * structureDisplacementPerN(kernel, frequencyHz);
}

/** Stroke |x_j − x_s| of damper j per newton, m/N. */
export function tmdStrokePerN(kernel: ModeTmdKernel, frequencyHz: number, tmdIndex: number): number {
  const w = 2 * Math.PI * frequencyHz;
  const w2 = w * w;
  const m = kernel.tmdMassKg[tmdIndex];
  const dRe = kernel.tmdStiffnessNPerM[tmdIndex] - w2 * m;
  const dIm = w * kernel.tmdDampingNsPerM[tmdIndex];
  const den = Math.sqrt(dRe * dRe + dIm * dIm);
  if (den === 0) {
    // The own frequency of an undamped damper: x_s = 0 and the damper's spring carries the force, |x_j| = F / k_j.
    return 1 / kernel.tmdStiffnessNPerM[tmdIndex];
  }
  return (structureDisplacementPerN(kernel, frequencyHz) * w2 * m) / den;
}

/** Undamped natural frequencies of the coupled system, Hz, ascending (closed form for 0 or 1 damper). */
export function coupledNaturalFrequenciesHz(kernel: ModeTmdKernel): number[] {
  const n = kernel.tmdCount;
  const M = kernel.structureMassKg;
  const K = kernel.structureStiffnessNPerM;
  const toHz = (w2: number) => Math.sqrt(Math.max(w2, 0)) / (2 * Math.PI);
  if (n === 0) return [toHz(K / M)];
  if (n === 1) {
    const m = kernel.tmdMassKg[0];
    const k = kernel.tmdStiffnessNPerM[0];
    // M m ω⁴ − (M k + m (K + k)) ω² + K k = 0
    const a = M * m;
    const b = -(M * k + m * (K + k));
    const c = K * k;
    const disc = Math.sqrt(Math.max(b * b - 4 * a * c, 0));
    const q = -0.5 * (b - disc); // stable root pair
    return [toHz(c / q), toHz(q / a)].sort((x, y) => x - y);
  }
  // M^(−1/2) K M^(−1/2), symmetric (mass matrix diagonal).
  const size = n + 1;
  const A = Matrix.zeros(size, size);
  const sm = [Math.sqrt(M), ...Array.from(kernel.tmdMassKg, (v) => Math.sqrt(v))];
  let k00 = K;
  for (let j = 0; j < n; j++) {
    const k = kernel.tmdStiffnessNPerM[j];
    k00 += k;
    A.set(0, j + 1, -k / (sm[0] * sm[j + 1]));
    A.set(j + 1, 0, -k / (sm[0] * sm[j + 1]));
    A.set(j + 1, j + 1, k / kernel.tmdMassKg[j]);
  }
  A.set(0, 0, k00 / M);
  const evd = new EigenvalueDecomposition(A, { assumeSymmetric: true });
  return evd.realEigenvalues.map(toHz).sort((x, y) => x - y);
}

/** A band of force frequencies with the modal force amplitude F(f) (N) applied at each of them. */
export interface ForceBand {
  loHz: number;
  hiHz: number;
  /** Modal force amplitude at force frequency f, N. */
  forceN: (frequencyHz: number) => number;
  /** Frequencies inside the band where F(f) changes slope (hints for the search). */
  kinksHz?: readonly number[];
  /** What the band stands for (a harmonic of a gait, a guide's crowd band …). */
  label: string;
}

export interface PeakOptions {
  /** Uniform samples per band before refinement (default 48). */
  samples?: number;
  /** Extra sample points (resonances). */
  hintsHz?: readonly number[];
  /** Golden-section stop, relative to the band width (default 1e-5). */
  relativeTolerance?: number;
}

export interface PeakResult {
  frequencyHz: number;
  value: number;
}

const invPhi = (Math.sqrt(5) - 1) / 2;

function golden(fn: (x: number) => number, a0: number, b0: number, tol: number, best: PeakResult): void {
  let a = a0;
  let b = b0;
  let c = b - invPhi * (b - a);
  let d = a + invPhi * (b - a);
  let fc = fn(c);
  let fd = fn(d);
  while (b - a > tol) {
    if (fc >= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - invPhi * (b - a);
      fc = fn(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + invPhi * (b - a);
      fd = fn(d);
    }
  }
  if (fc > best.value) { best.value = fc; best.frequencyHz = c; }
  if (fd > best.value) { best.value = fd; best.frequencyHz = d; }
}

// Scratch buffers reused across calls, one pair per nesting depth (a search may call a search: the worst case over
// structure frequencies maximises a function that is itself a peak search).
const scratchPool: Array<{ xs: Float64Array; vs: Float64Array }> = [];
let depth = 0;

/**
 * The continuous maximum of a non-negative function on [lo, hi]: uniform samples plus hints, then golden-section
 * refinement of each local maximum of the samples whose value is at least half the largest sample.
 */
export function maximiseContinuous(
  fn: (frequencyHz: number) => number,
  loHz: number,
  hiHz: number,
  options: PeakOptions = {},
): PeakResult {
  if (!(hiHz >= loHz)) throw new RangeError(`band must satisfy lo ≤ hi, got [${loHz}, ${hiHz}]`);
  const best: PeakResult = { frequencyHz: loHz, value: -Infinity };
  if (hiHz === loHz) {
    best.value = fn(loHz);
    return best;
  }
  const samples = Math.max(4, options.samples ?? 48);
  const hints = options.hintsHz ?? [];
  const cap = samples + 1 + hints.length;
  let scratch = scratchPool[depth];
  if (!scratch || scratch.xs.length < cap) {
    scratch = { xs: new Float64Array(Math.max(cap * 2, 128)), vs: new Float64Array(Math.max(cap * 2, 128)) };
    scratchPool[depth] = scratch;
  }
  depth++;
  try {
    return searchWithBuffers(fn, loHz, hiHz, samples, hints, scratch.xs, scratch.vs, options.relativeTolerance ?? 1e-5, best);
  } finally {
    depth--;
  }
}

function searchWithBuffers(
  fn: (frequencyHz: number) => number,
  loHz: number,
  hiHz: number,
  samples: number,
  hints: readonly number[],
  xs: Float64Array,
  vs: Float64Array,
  relativeTolerance: number,
  best: PeakResult,
): PeakResult {
  // Merge the uniform grid with the sorted hints inside the open band.
  const inside: number[] = [];
  for (const h of hints) if (h > loHz && h < hiHz) inside.push(h);
  inside.sort((p, q) => p - q);
  const step = (hiHz - loHz) / samples;
  let count = 0;
  let hi = 0;
  for (let i = 0; i <= samples; i++) {
    const x = i === samples ? hiHz : loHz + i * step;
    while (hi < inside.length && inside[hi] < x) xs[count++] = inside[hi++];
    xs[count++] = x;
  }
  let top = -Infinity;
  for (let i = 0; i < count; i++) {
    const v = fn(xs[i]);
    vs[i] = v;
    if (v > top) top = v;
    if (v > best.value) { best.value = v; best.frequencyHz = xs[i]; }
  }
  if (!Number.isFinite(top)) return best;
  const tol = (hiHz - loHz) * relativeTolerance;
  for (let i = 0; i < count; i++) {
    const v = vs[i];
    if (v < 0.5 * top) continue;
    const left = i > 0 ? vs[i - 1] : -Infinity;
    const right = i < count - 1 ? vs[i + 1] : -Infinity;
    if (v >= left && v >= right) {
      const a = i > 0 ? xs[i - 1] : xs[i];
      const b = i < count - 1 ? xs[i + 1] : xs[i];
      if (b > a) golden(fn, a, b, tol, best);
    }
  }
  return best;
}

export type EnvelopeQuantity = 'structureAcceleration' | 'tmdStroke';

export interface EnvelopePeak {
  frequencyHz: number;
  value: number;
  bandIndex: number;
  forceN: number;
}

/**
 * max over the bands and their frequencies of |response per N (f)| × F(f) (and optionally divided by a
 * frequency-dependent limit, for criteria whose limit depends on frequency).
 */
export function findEnvelopePeak(
  kernel: ModeTmdKernel,
  bands: readonly ForceBand[],
  quantity: EnvelopeQuantity = 'structureAcceleration',
  options: { tmdIndex?: number; samples?: number; hintsHz?: readonly number[]; divisor?: (frequencyHz: number) => number } = {},
): EnvelopePeak {
  const tmdIndex = options.tmdIndex ?? 0;
  if (quantity === 'tmdStroke' && !(tmdIndex >= 0 && tmdIndex < kernel.tmdCount)) {
    throw new RangeError(`tmdIndex ${tmdIndex} is out of range for ${kernel.tmdCount} damper(s)`);
  }
  const hints = options.hintsHz ?? coupledNaturalFrequenciesHz(kernel);
  const divisor = options.divisor;
  const undamped = isUndamped(kernel);
  const result: EnvelopePeak = { frequencyHz: bands.length ? bands[0].loHz : 0, value: 0, bandIndex: 0, forceN: 0 };
  let first = true;
  for (let b = 0; b < bands.length; b++) {
    const band = bands[b];
    const force = band.forceN;
    // Without any damping the response is infinite at a resonance; where the force vanishes there (a ψ edge) the
    // product is 0, not 0 × ∞ = NaN. Damped kernels never reach ∞ and keep the lean closures.
    const fn = undamped
      ? quantity === 'structureAcceleration'
        ? (f: number) => {
            const F = force(f);
            return F === 0 ? 0 : (structureAccelerationPerN(kernel, f) * F) / (divisor ? divisor(f) : 1);
          }
        : (f: number) => {
            const F = force(f);
            return F === 0 ? 0 : tmdStrokePerN(kernel, f, tmdIndex) * F;
          }
      : quantity === 'structureAcceleration'
        ? divisor
          ? (f: number) => (structureAccelerationPerN(kernel, f) * force(f)) / divisor(f)
          : (f: number) => structureAccelerationPerN(kernel, f) * force(f)
        : (f: number) => tmdStrokePerN(kernel, f, tmdIndex) * force(f);
    const bandHints = band.kinksHz && band.kinksHz.length ? [...hints, ...band.kinksHz] : hints;
    const peak = maximiseContinuous(fn, band.loHz, band.hiHz, { samples: options.samples, hintsHz: bandHints });
    if (first || peak.value > result.value) {
      first = false;
      result.value = peak.value;
      result.frequencyHz = peak.frequencyHz;
      result.bandIndex = b;
      result.forceN = force(peak.frequencyHz);
    }
  }
  return result;
}

/** True when the kernel has no damping anywhere: neither the structure nor any damper. */
export function isUndamped(kernel: ModeTmdKernel): boolean {
  if (kernel.structureDampingNsPerM !== 0) return false;
  for (let j = 0; j < kernel.tmdCount; j++) if (kernel.tmdDampingNsPerM[j] !== 0) return false;
  return true;
}

/**
 * The first frequency at which the steady-state structure response to the load is unbounded, or null.
 * Only an undamped system (ζ = 0 everywhere) has one: a coupled natural frequency inside a band (edges included,
 * to 1e-12 relative) where the force is not 0. A coupled mode at a damper's own frequency (several equal undamped
 * dampers) leaves the structure at rest and is not a resonance of the structure.
 */
export function unboundedResonanceHz(kernel: ModeTmdKernel, bands: readonly ForceBand[]): { frequencyHz: number; band: ForceBand } | null {
  if (!isUndamped(kernel)) return null;
  const own: number[] = [];
  for (let j = 0; j < kernel.tmdCount; j++) own.push(Math.sqrt(kernel.tmdStiffnessNPerM[j] / kernel.tmdMassKg[j]) / (2 * Math.PI));
  const natural =
    kernel.tmdCount === 0
      ? [Math.sqrt(kernel.structureStiffnessNPerM / kernel.structureMassKg) / (2 * Math.PI)]
      : coupledNaturalFrequenciesHz(kernel);
  for (const f of natural) {
    if (!(f > 0)) continue;
    if (own.some((fj) => Math.abs(f - fj) <= 1e-9 * f)) continue;
    for (const band of bands) {
      const tol = 1e-12 * band.hiHz;
      if (f >= band.loHz - tol && f <= band.hiHz + tol && band.forceN(Math.min(Math.max(f, band.loHz), band.hiHz)) > 0) {
        return { frequencyHz: f, band };
      }
    }
  }
  return null;
}

/**
 * For an undamped bare mode (ζ = 0, no damper) whose frequency may lie anywhere in [loHz, hiHz]: a structure
 * frequency of that range at which the load's force is not 0, i.e. where the steady-state peak is unbounded, or null.
 */
export function unboundedBareFrequencyHz(bands: readonly ForceBand[], rangeHz: readonly [number, number]): number | null {
  for (const band of bands) {
    const tol = 1e-12 * band.hiHz;
    const a = Math.max(rangeHz[0], band.loHz);
    const b = Math.min(rangeHz[1], band.hiHz);
    if (a > b + tol) continue;
    const lo = Math.min(a, b);
    const hi = Math.max(a, b);
    for (const f of [0.5 * (lo + hi), lo, hi]) {
      if (band.forceN(Math.min(Math.max(f, band.loHz), band.hiHz)) > 0) return f;
    }
  }
  return null;
}
