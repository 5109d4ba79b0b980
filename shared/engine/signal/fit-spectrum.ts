import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { dampingRatioFromHalfPower } from './formulas';

/**
 * The peak of a power spectral density in a band, its half-power bandwidth, and a least-squares fit of a single
 * mode's response shape to the spectrum around the peak.
 */

/** The largest PSD value within a band must stand this far above the band's median to count as a clear peak (10 dB). */
export const CLEAR_PEAK_RATIO = 10;

export interface SpectrumPeak {
  index: number;
  /** Peak frequency refined by a parabola through the logarithms of the three highest bins. */
  frequencyHz: number;
  psd: number;
  /** Peak value divided by the median of the band. */
  prominence: number;
}

export type PeakSearch = { found: true; peak: SpectrumPeak } | { found: false; reason: string };

/** The largest bin with lo ≤ f ≤ hi; refuses a maximum on the band's edge or one that does not stand out. */
export function findSpectrumPeak(frequencyHz: Float64Array, psd: Float64Array, bandHz: readonly [number, number]): PeakSearch {
  let first = -1;
  let last = -1;
  for (let k = 0; k < frequencyHz.length; k++) {
    if (frequencyHz[k] >= bandHz[0] && frequencyHz[k] <= bandHz[1]) {
      if (first < 0) first = k;
      last = k;
    }
  }
  if (first < 0 || last - first < 4) {
    return { found: false, reason: `the band ${bandHz[0]}–${bandHz[1]} Hz holds fewer than 5 spectral lines; widen bandHz or give a longer record` };
  }
  let index = first;
  for (let k = first; k <= last; k++) if (psd[k] > psd[index]) index = k;
  const values = Array.from(psd.subarray(first, last + 1)).sort((a, b) => a - b);
  const median = values[Math.floor(values.length / 2)];
  const prominence = median > 0 ? psd[index] / median : Infinity;
  if (index === first || index === last) {
    return { found: false, reason: `the spectrum is largest at the edge of the band (${frequencyHz[index].toPrecision(4)} Hz), not at a peak inside it; widen or move bandHz` };
  }
  if (!(prominence >= CLEAR_PEAK_RATIO)) {
    return {
      found: false,
      reason: `no clear peak in ${bandHz[0]}–${bandHz[1]} Hz: the largest value stands only ${(10 * Math.log10(prominence)).toFixed(1)} dB above the band's median (at least 10 dB needed)`,
    };
  }
  const a = Math.log(psd[index - 1]);
  const b = Math.log(psd[index]);
  const c = Math.log(psd[index + 1]);
  const curvature = a - 2 * b + c;
  const offset = curvature < 0 ? (0.5 * (a - c)) / curvature : 0;
  const step = frequencyHz[1] - frequencyHz[0];
  return { found: true, peak: { index, frequencyHz: frequencyHz[index] + offset * step, psd: psd[index], prominence } };
}

export interface HalfPower {
  lowerHz: number;
  upperHz: number;
  dampingRatio: number;
  /** Half-power bandwidth in spectral lines (under about 4 the estimate is biased high by the window). */
  bandwidthLines: number;
}

/** Where the PSD first falls to half the peak value on each side (linear interpolation between lines), or null. */
export function findHalfPower(frequencyHz: Float64Array, psd: Float64Array, peak: SpectrumPeak, bandHz: readonly [number, number]): HalfPower | null {
  const half = peak.psd / 2;
  let lowerHz = NaN;
  for (let k = peak.index; k > 0 && frequencyHz[k - 1] >= bandHz[0]; k--) {
    if (psd[k - 1] <= half) {
      lowerHz = frequencyHz[k - 1] + ((half - psd[k - 1]) / (psd[k] - psd[k - 1])) * (frequencyHz[k] - frequencyHz[k - 1]);
      break;
    }
  }
  let upperHz = NaN;
  for (let k = peak.index; k < psd.length - 1 && frequencyHz[k + 1] <= bandHz[1]; k++) {
    if (psd[k + 1] <= half) {
      upperHz = frequencyHz[k] + ((psd[k] - half) / (psd[k] - psd[k + 1])) * (frequencyHz[k + 1] - frequencyHz[k]);
      break;
    }
  }
  if (!Number.isFinite(lowerHz) || !Number.isFinite(upperHz)) return null;
  const step = frequencyHz[1] - frequencyHz[0];
  return { lowerHz, upperHz, dampingRatio: dampingRatioFromHalfPower(lowerHz, upperHz, peak.frequencyHz), bandwidthLines: (upperHz - lowerHz) / step };
}

/**
 * The response shape of one mode to a broadband force, as acceleration: S(f) = H·4ζ²r⁴ / ((1 − r²)² + 4ζ²r²) + B,
 * r = f/f_n (H is the value at f = f_n; B a flat background of noise and other modes).
 */
export function singleModeShape(frequencyHz: number, naturalFrequencyHz: number, dampingRatio: number, peakPsd: number, backgroundPsd: number): number {
  const r = frequencyHz / naturalFrequencyHz;
  const r2 = r * r;
  const z = 4 * dampingRatio * dampingRatio;
  const u = 1 - r2;
  return (peakPsd * z * r2 * r2) / (u * u + z * r2) + backgroundPsd;
}

/**
 * The averaging kernel of a Hann-windowed spectral line: E[P(f_k)] = ∫ S(f) |W(f_k − f)|² df / ∫ |W|² df, with
 * W(b) = sinc(b)/(1 − b²) in units of lines b (Harris, "On the use of windows for harmonic analysis with the discrete
 * Fourier transform", Proc. IEEE 66, 1978). Sampled at `step` lines over ±`halfWidth` lines, weights summing to 1.
 */
export function hannLineKernel(halfWidth = 6, step = 0.125): { offsetsLines: Float64Array; weights: Float64Array } {
  const count = Math.round((2 * halfWidth) / step) + 1;
  const offsetsLines = new Float64Array(count);
  const weights = new Float64Array(count);
  let sum = 0;
  for (let j = 0; j < count; j++) {
    const b = -halfWidth + j * step;
    offsetsLines[j] = b;
    let w: number;
    if (Math.abs(b) < 1e-12) w = 1;
    else if (Math.abs(Math.abs(b) - 1) < 1e-12) w = 0.5;
    else w = Math.sin(Math.PI * b) / (Math.PI * b) / (1 - b * b);
    weights[j] = w * w;
    sum += w * w;
  }
  for (let j = 0; j < count; j++) weights[j] /= sum;
  return { offsetsLines, weights };
}

export interface SingleModeFit {
  naturalFrequencyHz: number;
  dampingRatio: number;
  peakPsd: number;
  backgroundPsd: number;
  fitBandHz: [number, number];
  pointCount: number;
  iterations: number;
  /** Root-mean-square of ln(measured) − ln(fitted) over the fitted lines (≈ 1/√(segments) for a good fit). */
  rmsLogResidual: number;
  /** Coefficient of determination of the fit of ln(PSD). */
  rSquared: number;
  /** Lines fitted and the fitted (window-averaged) shape at them, for the plot. */
  frequencyHz: Float64Array;
  fittedPsd: Float64Array;
  /** True when ζ or f_n ended on a bound of the search (the fit is then not to be trusted). */
  atBound: boolean;
}

/** The fit spans f_p ± this many × ζ₀f_p (four half-power bandwidths each side: the skirts carry as much about ζ as the top). */
export const FIT_HALF_WIDTH_DAMPINGS = 8;
const MIN_DAMPING = 1e-4;
/** At most this many rounds of ten Levenberg–Marquardt iterations. */
const FIT_ROUNDS = 20;
const MAX_DAMPING = 0.3;

/**
 * Least-squares fit (Levenberg–Marquardt, ml-levenberg-marquardt) of ln of the window-averaged single-mode shape to
 * ln of the Welch PSD over the lines within f_p(1 ± w), w = max(8ζ₀, 6Δf/f_p), ζ₀ the starting damping (the
 * half-power estimate, or 2Δf/f_p), kept inside the band. Fitting logarithms weighs every line by its relative
 * scatter, which is the same for all lines of an averaged periodogram. The model is averaged over the Hann window's
 * line shape, so a resolution as coarse as two lines per half-power bandwidth does not bias ζ upward.
 */
export function fitSingleMode(
  frequencyHz: Float64Array,
  psd: Float64Array,
  peak: SpectrumPeak,
  bandHz: readonly [number, number],
  startDampingRatio: number,
): SingleModeFit | null {
  const step = frequencyHz[1] - frequencyHz[0];
  const fp = peak.frequencyHz;
  const zeta0 = Math.min(MAX_DAMPING / 2, Math.max(startDampingRatio, step / fp, MIN_DAMPING * 10));
  const halfWidthHz = Math.max(FIT_HALF_WIDTH_DAMPINGS * zeta0 * fp, 6 * step);
  const loHz = Math.max(bandHz[0], fp - halfWidthHz);
  const hiHz = Math.min(bandHz[1], fp + halfWidthHz);
  let first = peak.index;
  let last = peak.index;
  while (first > 1 && frequencyHz[first - 1] >= loHz) first--;
  while (last < frequencyHz.length - 1 && frequencyHz[last + 1] <= hiHz) last++;
  const count = last - first + 1;
  const x = frequencyHz.slice(first, last + 1);
  const y = new Float64Array(count);
  const scale = peak.psd;
  let background0 = Infinity;
  for (let i = 0; i < count; i++) {
    // Lines of exactly zero (a synthetic or clipped record) are floored 240 dB below the peak to keep logarithms finite.
    const value = Math.max(psd[first + i] / scale, 1e-24);
    y[i] = Math.log(value);
    background0 = Math.min(background0, value);
  }
  const { offsetsLines, weights } = hannLineKernel();
  const kernelSize = weights.length;
  const model = (p: number[]) => {
    const h = Math.exp(p[0]);
    const fn = p[1] * fp;
    const zeta = Math.exp(p[2]);
    const b = p[3];
    return (f: number) => {
      let sum = 0;
      for (let j = 0; j < kernelSize; j++) sum += weights[j] * singleModeShape(Math.abs(f + offsetsLines[j] * step), fn, zeta, h, b);
      return Math.log(sum);
    };
  };
  const frequencyRange = Math.max(0.02, (3 * step) / fp);
  // ml-levenberg-marquardt stops only on an absolute error or an iteration count: run it in rounds of ten
  // iterations from where the last round ended, until a round no longer lowers the sum of squares by 1 part in 10⁹.
  let parameters = [0, 1, Math.log(zeta0), Math.min(background0, 0.01)];
  let error = Infinity;
  let iterations = 0;
  try {
    for (let round = 0; round < FIT_ROUNDS; round++) {
      const result = levenbergMarquardt({ x, y }, model, {
        initialValues: parameters,
        minValues: [Math.log(1e-3), 1 - frequencyRange, Math.log(MIN_DAMPING), 0],
        maxValues: [Math.log(1e3), 1 + frequencyRange, Math.log(MAX_DAMPING), 1],
        gradientDifference: [1e-6, 1e-7, 1e-6, 1e-7],
        centralDifference: true,
        damping: 1e-2,
        maxIterations: 10,
        errorTolerance: 1e-12,
      });
      iterations += result.iterations;
      const improved = error - result.parameterError;
      parameters = result.parameterValues;
      const previous = error;
      error = Math.min(error, result.parameterError);
      if (Number.isFinite(previous) && !(improved > 1e-9 * previous)) break;
    }
  } catch {
    // The fit broke down (a singular step on a spectrum that is not a mode's, such as a pure sine's): no answer.
    return null;
  }
  const result = { parameterValues: parameters, iterations };
  const p = result.parameterValues;
  if (!p.every(Number.isFinite)) return null;
  const fitted = model(p);
  const fittedPsd = new Float64Array(count);
  let mean = 0;
  for (let i = 0; i < count; i++) mean += y[i];
  mean /= count;
  let residual = 0;
  let total = 0;
  for (let i = 0; i < count; i++) {
    const m = fitted(x[i]);
    fittedPsd[i] = Math.exp(m) * scale;
    residual += (y[i] - m) ** 2;
    total += (y[i] - mean) ** 2;
  }
  const dampingRatio = Math.exp(p[2]);
  const atBound =
    dampingRatio <= MIN_DAMPING * 1.001 || dampingRatio >= MAX_DAMPING * 0.999 || Math.abs(p[1] - 1) >= frequencyRange * 0.999;
  return {
    naturalFrequencyHz: p[1] * fp,
    dampingRatio,
    peakPsd: Math.exp(p[0]) * scale,
    backgroundPsd: p[3] * scale,
    fitBandHz: [x[0], x[count - 1]],
    pointCount: count,
    iterations: result.iterations,
    rmsLogResidual: Math.sqrt(residual / count),
    rSquared: total > 0 ? 1 - residual / total : 1,
    frequencyHz: x,
    fittedPsd,
    atBound,
  };
}
