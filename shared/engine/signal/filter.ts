/**
 * Zero-phase band-pass filtering: a Butterworth band-pass built from a 4th-order high-pass and a 4th-order low-pass,
 * each two second-order sections from the bilinear transform with pre-warping (R. Bristow-Johnson, "Cookbook formulae
 * for audio EQ biquad filter coefficients", the LPF/HPF sections with the Butterworth Q values
 * 1/(2 cos(π/8)) and 1/(2 cos(3π/8))), run forward and then backward over the record so that the phase cancels
 * and the magnitude is squared (−6 dB at each edge, 48 dB per octave outside).
 */

/** Second-order sections, five coefficients each (b0, b1, b2, a1, a2; a0 = 1), row-major. */
export interface BandPassFilter {
  sections: Float64Array;
  sectionCount: number;
  lowHz: number;
  highHz: number;
  /** Slowest decay rate of the filter's own poles, 1/s (sets how long its start and end transients last). */
  slowestDecayRatePerS: number;
}

const BUTTERWORTH_4_Q = [1 / (2 * Math.cos(Math.PI / 8)), 1 / (2 * Math.cos((3 * Math.PI) / 8))];

function writeSection(out: Float64Array, index: number, kind: 'low' | 'high', cutoffHz: number, sampleRateHz: number, q: number): void {
  const w0 = (2 * Math.PI * cutoffHz) / sampleRateHz;
  const cos = Math.cos(w0);
  const alpha = Math.sin(w0) / (2 * q);
  const a0 = 1 + alpha;
  const b0 = kind === 'low' ? (1 - cos) / 2 : (1 + cos) / 2;
  const b1 = kind === 'low' ? 1 - cos : -(1 + cos);
  const o = 5 * index;
  out[o] = b0 / a0;
  out[o + 1] = b1 / a0;
  out[o + 2] = b0 / a0;
  out[o + 3] = (-2 * cos) / a0;
  out[o + 4] = (1 - alpha) / a0;
}

export function designBandPass(lowHz: number, highHz: number, sampleRateHz: number): BandPassFilter {
  if (!(lowHz > 0 && highHz > lowHz && highHz < sampleRateHz / 2)) {
    throw new RangeError(`band: must satisfy 0 < low < high < Nyquist ${sampleRateHz / 2} Hz (got ${lowHz}–${highHz} Hz)`);
  }
  const sections = new Float64Array(20);
  writeSection(sections, 0, 'high', lowHz, sampleRateHz, BUTTERWORTH_4_Q[0]);
  writeSection(sections, 1, 'high', lowHz, sampleRateHz, BUTTERWORTH_4_Q[1]);
  writeSection(sections, 2, 'low', highHz, sampleRateHz, BUTTERWORTH_4_Q[0]);
  writeSection(sections, 3, 'low', highHz, sampleRateHz, BUTTERWORTH_4_Q[1]);
  // The analogue pole pair of quality Q at ω_c decays at ω_c/(2Q); the high-pass at the low edge is the slowest.
  const slowestDecayRatePerS = (2 * Math.PI * lowHz) / (2 * BUTTERWORTH_4_Q[1]);
  return { sections, sectionCount: 4, lowHz, highHz, slowestDecayRatePerS };
}

/** Runs the sections over `data` in place (transposed direct form II, zero initial state), forward or backward. */
function runSections(filter: BandPassFilter, data: Float64Array, reverse: boolean): void {
  const n = data.length;
  for (let s = 0; s < filter.sectionCount; s++) {
    const o = 5 * s;
    const b0 = filter.sections[o];
    const b1 = filter.sections[o + 1];
    const b2 = filter.sections[o + 2];
    const a1 = filter.sections[o + 3];
    const a2 = filter.sections[o + 4];
    let z1 = 0;
    let z2 = 0;
    for (let step = 0; step < n; step++) {
      const i = reverse ? n - 1 - step : step;
      const x = data[i];
      const y = b0 * x + z1;
      z1 = b1 * x - a1 * y + z2;
      z2 = b2 * x - a2 * y;
      data[i] = y;
    }
  }
}

/**
 * Forward-backward filtering of `record` (zero phase). The record is extended at both ends by its odd reflection
 * (2x₀ − x_k) over `padLength` samples (default: long enough for the filter's own transient to fall below 10⁻⁶,
 * at most the record length − 1), which is cut off again. Returns a new array of the record's length.
 */
export function filterZeroPhase(filter: BandPassFilter, record: Float64Array, sampleRateHz: number, padLength?: number): Float64Array {
  const n = record.length;
  const pad = Math.min(n - 1, padLength ?? Math.ceil((14 / filter.slowestDecayRatePerS) * sampleRateHz));
  const work = new Float64Array(n + 2 * pad);
  const first = record[0];
  const last = record[n - 1];
  for (let i = 0; i < pad; i++) {
    work[pad - 1 - i] = 2 * first - record[i + 1];
    work[pad + n + i] = 2 * last - record[n - 2 - i];
  }
  work.set(record, pad);
  runSections(filter, work, false);
  runSections(filter, work, true);
  return work.slice(pad, pad + n);
}

/** Amplitude gain of the forward-backward filter at `frequencyHz`: |H(f)|², the squared magnitude of the one-way filter. */
export function zeroPhaseGain(filter: BandPassFilter, frequencyHz: number, sampleRateHz: number): number {
  const w = (2 * Math.PI * frequencyHz) / sampleRateHz;
  const c1 = Math.cos(w);
  const s1 = Math.sin(w);
  const c2 = Math.cos(2 * w);
  const s2 = Math.sin(2 * w);
  let gain = 1;
  for (let s = 0; s < filter.sectionCount; s++) {
    const o = 5 * s;
    const [b0, b1, b2, a1, a2] = [filter.sections[o], filter.sections[o + 1], filter.sections[o + 2], filter.sections[o + 3], filter.sections[o + 4]];
    const numRe = b0 + b1 * c1 + b2 * c2;
    const numIm = -(b1 * s1 + b2 * s2);
    const denRe = 1 + a1 * c1 + a2 * c2;
    const denIm = -(a1 * s1 + a2 * s2);
    gain *= (numRe * numRe + numIm * numIm) / (denRe * denRe + denIm * denIm);
  }
  return gain;
}
