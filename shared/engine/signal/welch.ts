import { createRealFft, previousPowerOfTwo } from './fft';

/**
 * Welch's averaged periodogram (Welch, IEEE Trans. Audio Electroacoustics AU-15, 1967): the record is cut into
 * segments of `segmentLength` samples that overlap by half, each segment has its mean removed and is multiplied by a
 * periodic Hann window, and the squared magnitudes of their FFTs are averaged. One-sided density in (unit)²/Hz:
 * P_k = c · mean |X_k|² / (f_s Σ w²), c = 2 except at DC and Nyquist (c = 1), so that Σ P_k Δf is the variance.
 */
export interface WelchSpectrum {
  /** Bin frequencies k·f_s/N, k = 0…N/2. */
  frequencyHz: Float64Array;
  /** One-sided power spectral density at each bin, (unit of the record)²/Hz. */
  psd: Float64Array;
  /** Bin spacing f_s/N. */
  resolutionHz: number;
  segmentLength: number;
  segmentCount: number;
}

/** The periodic Hann window w_n = ½(1 − cos 2πn/N), n = 0…N−1 (the DFT-even form used for spectra). */
export function hannWindow(length: number): Float64Array {
  const w = new Float64Array(length);
  for (let i = 0; i < length; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / length);
  return w;
}

/** Number of half-overlapping segments of `segmentLength` in `sampleCount` samples. */
export function welchSegmentCount(sampleCount: number, segmentLength: number): number {
  if (segmentLength > sampleCount) return 0;
  return Math.floor((sampleCount - segmentLength) / (segmentLength / 2)) + 1;
}

export function welchPsd(record: Float64Array, sampleRateHz: number, segmentLength: number): WelchSpectrum {
  if (segmentLength < 4 || (segmentLength & (segmentLength - 1)) !== 0 || segmentLength > record.length) {
    throw new RangeError(`segmentLength: must be a power of two from 4 to the record length ${record.length} (got ${segmentLength})`);
  }
  const n = segmentLength;
  const half = n / 2;
  const hop = half;
  const window = hannWindow(n);
  let windowPower = 0;
  for (let i = 0; i < n; i++) windowPower += window[i] * window[i];
  const fft = createRealFft(n);
  const segment = new Float64Array(n);
  const sum = new Float64Array(half + 1);
  const segmentCount = welchSegmentCount(record.length, n);
  for (let s = 0; s < segmentCount; s++) {
    const start = s * hop;
    let mean = 0;
    for (let i = 0; i < n; i++) mean += record[start + i];
    mean /= n;
    for (let i = 0; i < n; i++) segment[i] = (record[start + i] - mean) * window[i];
    const spectrum = fft.transform(segment);
    for (let k = 0; k <= half; k++) {
      const re = spectrum[2 * k];
      const im = spectrum[2 * k + 1];
      sum[k] += re * re + im * im;
    }
  }
  const scale = 1 / (sampleRateHz * windowPower * segmentCount);
  const psd = new Float64Array(half + 1);
  const frequencyHz = new Float64Array(half + 1);
  for (let k = 0; k <= half; k++) {
    psd[k] = sum[k] * scale * (k === 0 || k === half ? 1 : 2);
    frequencyHz[k] = (k * sampleRateHz) / n;
  }
  return { frequencyHz, psd, resolutionHz: sampleRateHz / n, segmentLength: n, segmentCount };
}

/** Damping ratio the segment length is chosen for when nothing else is known: the low end of footbridges (common practice). */
export const REFERENCE_DAMPING_RATIO = 0.005;
/** Fewest half-overlapping segments averaged (fewer leaves the spectrum too noisy to fit). */
export const MIN_SEGMENTS = 8;

/**
 * Segment length for a Welch spectrum around `frequencyHz`: the shortest power of two whose resolution
 * Δf = f_s/N is at most ζ_ref·f, so that the half-power bandwidth 2ζ_ref·f of a mode damped as lightly as
 * `referenceDampingRatio` spans at least two bins; but never so long that fewer than `minSegments` segments fit the
 * record (then the resolution is coarser and the caller warns when the fitted bandwidth is under two bins).
 */
export function chooseSegmentLength(
  sampleCount: number,
  sampleRateHz: number,
  frequencyHz: number,
  { referenceDampingRatio = REFERENCE_DAMPING_RATIO, minSegments = MIN_SEGMENTS } = {},
): number {
  let n = 4;
  const targetResolutionHz = referenceDampingRatio * frequencyHz;
  while (sampleRateHz / n > targetResolutionHz && n * 2 <= sampleCount) n *= 2;
  while (n > 64 && welchSegmentCount(sampleCount, n) < minSegments) n /= 2;
  return Math.min(n, previousPowerOfTwo(sampleCount));
}
