/**
 * Continuous maximum of a scalar function on a closed interval.
 *
 * The interval is sampled (log-spaced when it lies on the positive axis, linear otherwise), the caller's hints
 * (for example the natural frequencies of a lightly damped system, where a narrow peak can hide between samples)
 * are merged into the samples, and every sampled local maximum worth refining is polished by Brent's method
 * (golden section with parabolic steps). Endpoints take part like any other point, so a maximum on the boundary
 * of the interval is found exactly. Kinks (a piecewise-linear weight) and flat zero parts are fine: Brent falls back
 * to golden-section steps where a parabola does not fit.
 */

export interface MaximiseOptions {
  /** Number of grid samples on the interval, at least 3 (default DEFAULT_SAMPLES = 32). */
  samples?: number;
  /** Relative tolerance on the location of the maximum (default DEFAULT_RELATIVE_TOLERANCE = 1e-7; the value is then far more accurate). */
  relativeTolerance?: number;
  /** Extra points to sample (outside the interval they are ignored). */
  hints?: readonly number[];
}

export interface IntervalMaximum {
  x: number;
  value: number;
}

/** (3 − √5) / 2: the fraction of an interval where golden-section search places its next point. */
export const GOLDEN_SECTION_FRACTION = 0.3819660112501051;
/** Grid samples on the interval when `samples` is not given. */
export const DEFAULT_SAMPLES = 32;
/** Relative tolerance on the location of the maximum when `relativeTolerance` is not given. */
export const DEFAULT_RELATIVE_TOLERANCE = 1e-7;
/** At most this many sampled local maxima are refined, the highest first. */
const MAX_REFINEMENTS = 8;
/** A sampled local maximum is refined only when it reaches this fraction of the best sample (when that is ≥ 0). */
const REFINE_ABOVE_FRACTION_OF_BEST = 0.25;
/** On an interval that is not on the positive axis (linear grid): absolute tolerance = this × relative × max |end|. */
const LINEAR_ABSOLUTE_TOLERANCE_FACTOR = 1e-3;

function checkFinite(value: number, x: number): number {
  if (!Number.isFinite(value)) {
    throw new RangeError(`maximiseOnInterval: the function returned ${value} at x = ${x}`);
  }
  return value;
}

/**
 * Brent's method for the maximum of `fn` on [a, b], started from the interior point `x0` with value `f0`.
 * Returns the best point seen (never worse than x0).
 */
export function brentMaximise(
  fn: (x: number) => number,
  a: number,
  b: number,
  x0: number,
  f0: number,
  relativeTolerance: number,
  absoluteTolerance = 0,
  maxIterations = 100,
): IntervalMaximum {
  // Minimise g = −fn (Brent 1973, "Algorithms for Minimization without Derivatives", procedure localmin).
  let x = x0;
  let w = x0;
  let v = x0;
  let fx = -f0;
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const m = 0.5 * (a + b);
    const tol = relativeTolerance * Math.abs(x) + absoluteTolerance + 1e-300;
    const t2 = 2 * tol;
    if (Math.abs(x - m) <= t2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      // Parabola through x, w, v.
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < t2 || b - u < t2) d = x < m ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < m ? b : a) - x;
      d = GOLDEN_SECTION_FRACTION * e;
    }
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = -checkFinite(fn(u), u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, value: -fx };
}

/** Maximum of `fn` on the closed interval [lo, hi]; see the module comment for the method. */
export function maximiseOnInterval(
  fn: (x: number) => number,
  lo: number,
  hi: number,
  options: MaximiseOptions = {},
): IntervalMaximum {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) {
    throw new RangeError(`maximiseOnInterval: the interval [${lo}, ${hi}] must have finite ends`);
  }
  if (hi < lo) throw new RangeError(`maximiseOnInterval: the interval [${lo}, ${hi}] has hi < lo`);
  const samples = options.samples ?? DEFAULT_SAMPLES;
  if (!Number.isInteger(samples) || samples < 3) {
    throw new RangeError(`maximiseOnInterval: samples must be an integer of at least 3 (got ${samples})`);
  }
  const relativeTolerance = options.relativeTolerance ?? DEFAULT_RELATIVE_TOLERANCE;
  if (!(relativeTolerance > 0 && relativeTolerance < 0.1)) {
    throw new RangeError(`maximiseOnInterval: relativeTolerance must lie in (0, 0.1) (got ${relativeTolerance})`);
  }
  if (hi === lo) return { x: lo, value: checkFinite(fn(lo), lo) };

  const hints = options.hints ?? [];
  const xs = new Float64Array(samples + hints.length);
  const logarithmic = lo > 0;
  if (logarithmic) {
    const ratio = Math.pow(hi / lo, 1 / (samples - 1));
    let x = lo;
    for (let i = 0; i < samples; i++) {
      xs[i] = x;
      x *= ratio;
    }
  } else {
    const step = (hi - lo) / (samples - 1);
    for (let i = 0; i < samples; i++) xs[i] = lo + step * i;
  }
  xs[samples - 1] = hi;
  // Insert the hints into the sorted grid (insertion sort: few hints, already sorted grid).
  let count = samples;
  for (let h = 0; h < hints.length; h++) {
    const hint = hints[h];
    if (!(hint > lo && hint < hi)) continue;
    let i = count - 1;
    while (i >= 0 && xs[i] > hint) {
      xs[i + 1] = xs[i];
      i--;
    }
    xs[i + 1] = hint;
    count++;
  }
  const values = new Float64Array(count);
  let best = 0;
  for (let i = 0; i < count; i++) {
    values[i] = checkFinite(fn(xs[i]), xs[i]);
    if (values[i] > values[best]) best = i;
  }
  const scale = Math.max(Math.abs(lo), Math.abs(hi));
  const absoluteTolerance = logarithmic ? 0 : relativeTolerance * scale * LINEAR_ABSOLUTE_TOLERANCE_FACTOR;

  let resultX = xs[best];
  let resultValue = values[best];
  const threshold = resultValue >= 0 ? REFINE_ABOVE_FRACTION_OF_BEST * resultValue : resultValue;
  // Sampled local maxima above the threshold, refined highest first.
  const candidates = new Int32Array(count);
  let candidateCount = 0;
  for (let i = 0; i < count; i++) {
    const v = values[i];
    if (v < threshold) continue;
    const left = i > 0 ? values[i - 1] : -Infinity;
    const right = i < count - 1 ? values[i + 1] : -Infinity;
    if (!(v >= left && v >= right && (v > left || v > right))) continue;
    let k = candidateCount++;
    while (k > 0 && values[candidates[k - 1]] < v) {
      candidates[k] = candidates[k - 1];
      k--;
    }
    candidates[k] = i;
  }
  if (candidateCount > MAX_REFINEMENTS) candidateCount = MAX_REFINEMENTS;
  for (let c = 0; c < candidateCount; c++) {
    const i = candidates[c];
    const a = i > 0 ? xs[i - 1] : xs[i];
    const b = i < count - 1 ? xs[i + 1] : xs[i];
    let x0 = xs[i];
    let f0 = values[i];
    if (i === 0 || i === count - 1) {
      // Endpoint: start Brent inside the neighbouring cell, keep the endpoint value if it is larger.
      x0 = a + GOLDEN_SECTION_FRACTION * (b - a);
      f0 = checkFinite(fn(x0), x0);
    }
    const refined = brentMaximise(fn, a, b, x0, f0, relativeTolerance, absoluteTolerance);
    if (refined.value > resultValue) {
      resultValue = refined.value;
      resultX = refined.x;
    }
  }
  return { x: resultX, value: resultValue };
}
