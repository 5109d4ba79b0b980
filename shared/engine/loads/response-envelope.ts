/**
 * The envelope of a pedestrian load over its force-frequency bands: the continuous maximum over every band of
 * |response per N (f)| × F(f) for one structure mode with any number of TMDs attached at the same point (1 + n DOF).
 *
 * The response per newton is the engine's (../response: createModeTmdSystem, evaluateModeTmdSystem), including its
 * limits at the own frequency of an undamped damper. The peak search samples each band on a uniform grid plus hints
 * (the coupled system's undamped natural frequencies, the kinks of the load's force weight), then refines every
 * local maximum by golden-section search, so it finds the true continuous maximum, not the largest sample.
 * The search is this module's own rather than the engine's maximiseOnInterval / findResponsePeak (../peak,
 * ../response) for speed: those allocate their sample buffers on every call and cost about 5 µs per call before the
 * first evaluation, three to four times a whole envelope search here; the 101 × 101 robustness map then takes
 * ≈ 400 ms against its 100 ms budget. This search reuses its buffers (one pair per nesting depth).
 */

import { GOLDEN_SECTION_FRACTION } from '../peak';
import { createModeTmdPoint, evaluateModeTmdSystem, evaluateStructureAccelerationPerN, type ModeTmdSystem } from '../response';
import { accelerationEnvelopeKernel, type EnvelopeKernelPeak } from '../acceleration-envelope';

const kernelPeak: EnvelopeKernelPeak = { value: 0, frequencyHz: 0, bandIndex: 0 };

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
  hintsHz?: ArrayLike<number>;
  /** Golden-section stop, relative to the band width (default 1e-5). */
  relativeTolerance?: number;
}

export interface PeakResult {
  frequencyHz: number;
  value: number;
}

/** (√5 − 1) / 2, the golden-section ratio: 1 − GOLDEN_SECTION_FRACTION. */
const invPhi = 1 - GOLDEN_SECTION_FRACTION;

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
  hints: ArrayLike<number>,
  xs: Float64Array,
  vs: Float64Array,
  relativeTolerance: number,
  best: PeakResult,
): PeakResult {
  // Merge the uniform grid with the sorted hints inside the open band.
  const inside: number[] = [];
  for (let i = 0; i < hints.length; i++) if (hints[i] > loHz && hints[i] < hiHz) inside.push(hints[i]);
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
  /** The peak: m/s² (structureAcceleration), m (tmdStroke), or the ratio to the divisor when one is given. */
  value: number;
  bandIndex: number;
  forceN: number;
}

/**
 * max over the bands and their frequencies of |response per N (f)| × F(f) (and optionally divided by a
 * frequency-dependent limit, for criteria whose limit depends on frequency).
 */
export function findEnvelopePeak(
  system: ModeTmdSystem,
  bands: readonly ForceBand[],
  quantity: EnvelopeQuantity = 'structureAcceleration',
  options: { tmdIndex?: number; divisor?: (frequencyHz: number) => number } = {},
): EnvelopePeak {
  const tmdIndex = options.tmdIndex ?? 0;
  if (quantity === 'tmdStroke' && !(tmdIndex >= 0 && tmdIndex < system.tmdCount)) {
    throw new RangeError(`tmdIndex ${tmdIndex} is out of range for ${system.tmdCount} damper(s)`);
  }
  const divisor = options.divisor;
  if (quantity === 'structureAcceleration' && !divisor && !system.undamped && bands.length > 0) {
    // The structure's acceleration of a damped system: the fast kernel (../acceleration-envelope), same grid and hints.
    const kernel = accelerationEnvelopeKernel(bands, system.tmdCount);
    kernel.setSystem(system);
    const peak = kernel.peak(1, kernelPeak);
    return { frequencyHz: peak.frequencyHz, value: peak.value, bandIndex: peak.bandIndex, forceN: bands[peak.bandIndex].forceN(peak.frequencyHz) };
  }
  const hints = system.coupledFrequenciesHz;
  const point = createModeTmdPoint(system);
  const strokes = point.tmdStrokeMPerN;
  // The structure's acceleration needs no strokes; they are evaluated only when the stroke is asked for.
  const perN =
    quantity === 'structureAcceleration'
      ? (f: number) => evaluateStructureAccelerationPerN(system, f)
      : (f: number) => {
          evaluateModeTmdSystem(system, f, point);
          return strokes[tmdIndex];
        };
  const result: EnvelopePeak = { frequencyHz: bands.length ? bands[0].loHz : 0, value: 0, bandIndex: 0, forceN: 0 };
  let first = true;
  for (let b = 0; b < bands.length; b++) {
    const band = bands[b];
    const force = band.forceN;
    // Without any damping the response is infinite at a resonance; where the force vanishes there (a ψ edge) the
    // product is 0, not 0 × ∞ = NaN. Damped systems never reach ∞ and keep the lean closures.
    const fn = system.undamped
      ? (f: number) => {
          const F = force(f);
          return F === 0 ? 0 : (perN(f) * F) / (divisor ? divisor(f) : 1);
        }
      : divisor
        ? (f: number) => (perN(f) * force(f)) / divisor(f)
        : (f: number) => perN(f) * force(f);
    const bandHints = band.kinksHz && band.kinksHz.length ? [...hints, ...band.kinksHz] : hints;
    const peak = maximiseContinuous(fn, band.loHz, band.hiHz, { hintsHz: bandHints });
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

/**
 * The first frequency at which the steady-state structure response to the load is unbounded, or null.
 * Only an undamped system (ζ = 0 everywhere) has one: a coupled natural frequency inside a band (edges included,
 * to 1e-12 relative) where the force is not 0. A coupled mode at a damper's own frequency (several equal undamped
 * dampers) leaves the structure at rest and is not a resonance of the structure.
 */
export function unboundedResonanceHz(system: ModeTmdSystem, bands: readonly ForceBand[]): { frequencyHz: number; band: ForceBand } | null {
  if (!system.undamped) return null;
  for (const f of system.coupledFrequenciesHz) {
    if (!(f > 0)) continue;
    if (system.tmds.some((t) => Math.abs(f - t.frequencyHz) <= 1e-9 * f)) continue;
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
