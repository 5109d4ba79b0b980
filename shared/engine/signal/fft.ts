import FFT from 'fft.js';

/**
 * Thin wrappers around fft.js (a radix-4 FFT on interleaved re/im arrays). Sizes are powers of two; the caller pads.
 */

/** The smallest power of two ≥ n (n ≥ 1), at least 2. */
export function nextPowerOfTwo(n: number): number {
  let size = 2;
  while (size < n) size *= 2;
  return size;
}

/** The largest power of two ≤ n (n ≥ 2). */
export function previousPowerOfTwo(n: number): number {
  let size = 2;
  while (size * 2 <= n) size *= 2;
  return size;
}

/** A real-input FFT plan of a power-of-two size with its own work arrays (re-used between calls). */
export interface RealFft {
  size: number;
  /** Interleaved re/im spectrum of the last `transform` (2·size entries; bins 0…size/2 are meaningful). */
  spectrum: Float64Array;
  /** Transforms `input` (length `size`) into `spectrum`. */
  transform(input: Float64Array): Float64Array;
}

export function createRealFft(size: number): RealFft {
  const fft = new FFT(size);
  const spectrum = new Float64Array(2 * size);
  return {
    size,
    spectrum,
    transform(input) {
      fft.realTransform(spectrum, input);
      return spectrum;
    },
  };
}

/**
 * The analytic signal x + i·H{x} of a real record, by the FFT method (Marple, "Computing the discrete-time
 * 'analytic' signal via FFT", IEEE Trans. Signal Processing 47, 1999): the spectrum's negative frequencies are set
 * to zero, positive ones doubled, DC and Nyquist kept, then the inverse transform. The record is padded with zeros to
 * a power of two (its edges are then slightly disturbed: callers leave the first and last periods out).
 * Writes the magnitude (the envelope) into `envelope` and the phase in rad (wrapped to (−π, π]) into `phaseRad`.
 */
export function analyticSignal(signal: Float64Array, envelope: Float64Array, phaseRad: Float64Array): void {
  const n = signal.length;
  const size = nextPowerOfTwo(n);
  const fft = new FFT(size);
  const padded = new Float64Array(2 * size);
  for (let i = 0; i < n; i++) padded[2 * i] = signal[i];
  const spectrum = new Float64Array(2 * size);
  fft.transform(spectrum, padded);
  const half = size / 2;
  for (let k = 1; k < half; k++) {
    spectrum[2 * k] *= 2;
    spectrum[2 * k + 1] *= 2;
  }
  for (let k = half + 1; k < size; k++) {
    spectrum[2 * k] = 0;
    spectrum[2 * k + 1] = 0;
  }
  fft.inverseTransform(padded, spectrum);
  for (let i = 0; i < n; i++) {
    const re = padded[2 * i];
    const im = padded[2 * i + 1];
    envelope[i] = Math.hypot(re, im);
    phaseRad[i] = Math.atan2(im, re);
  }
}
