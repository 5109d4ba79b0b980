import { analyticSignal } from './fft';
import { designBandPass, filterZeroPhase, zeroPhaseGain } from './filter';

/**
 * Damping and frequency of a free decay. The record is band-passed around the mode without phase shift
 * (forward-backward Butterworth, `filter.ts`); its analytic signal gives the envelope A(t) and the phase φ(t).
 * For a viscously damped mode a(t) = A₀ e^{−σt} cos(ω_d t + φ₀), so ln A(t) = ln A₀ − σt and φ(t) = ω_d t + φ₀: two
 * straight lines, fitted by least squares over the part of the decay that stands clear of the filter's transients
 * and of the noise. Then ω_n = √(ω_d² + σ²), ζ = σ/ω_n and the logarithmic decrement δ = 2πσ/ω_d (Chopra, Dynamics
 * of Structures, ch. 2, from memory). A band-pass filter does not change σ or ω_d of a decaying exponential (it is
 * an eigenfunction of any linear time-invariant filter); only its own start and end transients do, and they are
 * left out.
 */

/** The fit uses the envelope down to this many times the noise floor (14 dB above it). */
export const DECAY_NOISE_MARGIN = 5;
/** Fewest cycles of the mode in the fitted part of the decay. */
export const MIN_DECAY_CYCLES = 3;
/** Largest number of points of the envelope returned for a plot. */
export const MAX_PLOT_POINTS = 2000;

export interface DecayFit {
  filterBandHz: [number, number];
  naturalFrequencyHz: number;
  dampedFrequencyHz: number;
  dampingRatio: number;
  decayRatePerS: number;
  logarithmicDecrement: number;
  fitStartS: number;
  fitEndS: number;
  cycleCount: number;
  /** Coefficient of determination of the straight line through ln A(t). */
  rSquared: number;
  /** Root-mean-square of ln A − fitted line over the fitted part. */
  rmsLogResidual: number;
  noiseFloorMPerS2: number;
  envelopeMaxMPerS2: number;
  /** The envelope, every `stride`-th sample (for a plot), with its times. */
  timesS: Float64Array;
  envelope: Float64Array;
  /** The fitted exponential A₀e^{−σt} at the plot times within the fitted part. */
  fitTimesS: Float64Array;
  fittedEnvelope: Float64Array;
}

export type DecayResult = { found: true; fit: DecayFit } | { found: false; reason: string; plot: { timesS: Float64Array; envelope: Float64Array; filterBandHz: [number, number] } };

function median(values: Float64Array): number {
  if (values.length === 0) return 0;
  const sorted = Float64Array.from(values).sort();
  return sorted[Math.floor(sorted.length / 2)];
}

/** Least-squares straight line y = a + b t over samples from..to−1 at times i/fs. */
function fitLine(y: Float64Array, from: number, to: number, sampleRateHz: number): { intercept: number; slope: number; rSquared: number; rms: number } {
  const count = to - from;
  let st = 0;
  let sy = 0;
  for (let i = from; i < to; i++) {
    st += i / sampleRateHz;
    sy += y[i];
  }
  const tm = st / count;
  const ym = sy / count;
  let stt = 0;
  let sty = 0;
  let syy = 0;
  for (let i = from; i < to; i++) {
    const dt = i / sampleRateHz - tm;
    const dy = y[i] - ym;
    stt += dt * dt;
    sty += dt * dy;
    syy += dy * dy;
  }
  const slope = sty / stt;
  const intercept = ym - slope * tm;
  const residual = Math.max(0, syy - slope * sty);
  return { intercept, slope, rSquared: syy > 0 ? 1 - residual / syy : 1, rms: Math.sqrt(residual / count) };
}

/**
 * Fits the strongest free decay of a record (mean removed) of the mode near `peakHz`. The filter passes
 * 0.8–1.2 × peakHz within `bandHz`; the fit starts where the filter's own response to the strongest point has died
 * to 10⁻³ and ends where the envelope falls to `DECAY_NOISE_MARGIN` × the noise floor (the median envelope of the
 * record's last fifth) or where the end transient begins.
 */
export function fitFreeDecay(record: Float64Array, sampleRateHz: number, peakHz: number, bandHz: readonly [number, number]): DecayResult {
  const n = record.length;
  const nyquistHz = sampleRateHz / 2;
  const lowHz = Math.max(0.8 * peakHz, bandHz[0]);
  const highHz = Math.min(1.2 * peakHz, bandHz[1], 0.95 * nyquistHz);
  const filter = designBandPass(lowHz, highHz, sampleRateHz);
  const filtered = filterZeroPhase(filter, record, sampleRateHz);
  // Undo the filter's gain at the mode, so that the envelope is the mode's own acceleration amplitude.
  const gain = zeroPhaseGain(filter, peakHz, sampleRateHz);
  for (let i = 0; i < n; i++) filtered[i] /= gain;
  const envelopeFull = new Float64Array(n);
  const phase = new Float64Array(n);
  analyticSignal(filtered, envelopeFull, phase);

  const stride = Math.max(1, Math.ceil(n / MAX_PLOT_POINTS));
  const plotCount = Math.ceil(n / stride);
  const timesS = new Float64Array(plotCount);
  const envelope = new Float64Array(plotCount);
  for (let j = 0; j < plotCount; j++) {
    timesS[j] = (j * stride) / sampleRateHz;
    envelope[j] = envelopeFull[j * stride];
  }
  const filterBandHz: [number, number] = [lowHz, highHz];
  const refuse = (reason: string): DecayResult => ({ found: false, reason, plot: { timesS, envelope, filterBandHz } });

  const transient = Math.ceil((Math.log(1e3) / filter.slowestDecayRatePerS) * sampleRateHz);
  let maxIndex = 0;
  for (let i = 1; i < n; i++) if (envelopeFull[i] > envelopeFull[maxIndex]) maxIndex = i;
  const start = maxIndex + transient;
  const endLimit = n - transient;
  const tail = envelopeFull.subarray(Math.max(start, Math.floor(0.8 * n) - transient), Math.max(start, endLimit));
  const noiseFloor = median(tail);
  const threshold = DECAY_NOISE_MARGIN * noiseFloor;
  let end = start;
  while (end < endLimit && envelopeFull[end] > threshold) end++;
  const minSamples = Math.ceil((MIN_DECAY_CYCLES * sampleRateHz) / peakHz);
  if (end - start < minSamples) {
    return refuse(
      `no free decay to fit: after the strongest point (${(maxIndex / sampleRateHz).toFixed(2)} s) and the filter's settling time, fewer than ${MIN_DECAY_CYCLES} cycles stand ${(20 * Math.log10(DECAY_NOISE_MARGIN)).toFixed(0)} dB above the noise before the record ends`,
    );
  }
  for (let i = start; i < end; i++) envelopeFull[i] = Math.log(envelopeFull[i]);
  const amplitude = fitLine(envelopeFull, start, end, sampleRateHz);
  // Unwrap the phase in place over the fitted part.
  let offset = 0;
  let previous = phase[start];
  for (let i = start + 1; i < end; i++) {
    const raw = phase[i];
    const jump = raw - previous;
    if (jump > Math.PI) offset -= 2 * Math.PI;
    else if (jump < -Math.PI) offset += 2 * Math.PI;
    previous = raw;
    phase[i] = raw + offset;
  }
  const phaseLine = fitLine(phase, start, end, sampleRateHz);
  const decayRatePerS = -amplitude.slope;
  const dampedAngularRadPerS = phaseLine.slope;
  if (!(decayRatePerS > 0) || !(dampedAngularRadPerS > 0)) {
    return refuse(`no free decay to fit: the envelope does not fall over ${(start / sampleRateHz).toFixed(2)}–${(end / sampleRateHz).toFixed(2)} s`);
  }
  const naturalAngular = Math.hypot(dampedAngularRadPerS, decayRatePerS);
  const fitStartS = start / sampleRateHz;
  const fitEndS = (end - 1) / sampleRateHz;
  const firstPlot = Math.ceil(start / stride);
  const lastPlot = Math.floor((end - 1) / stride);
  const fitCount = Math.max(0, lastPlot - firstPlot + 1);
  const fitTimesS = new Float64Array(fitCount);
  const fittedEnvelope = new Float64Array(fitCount);
  for (let j = 0; j < fitCount; j++) {
    const t = ((firstPlot + j) * stride) / sampleRateHz;
    fitTimesS[j] = t;
    fittedEnvelope[j] = Math.exp(amplitude.intercept + amplitude.slope * t);
  }
  const dampedFrequencyHz = dampedAngularRadPerS / (2 * Math.PI);
  return {
    found: true,
    fit: {
      filterBandHz,
      naturalFrequencyHz: naturalAngular / (2 * Math.PI),
      dampedFrequencyHz,
      dampingRatio: decayRatePerS / naturalAngular,
      decayRatePerS,
      logarithmicDecrement: (2 * Math.PI * decayRatePerS) / dampedAngularRadPerS,
      fitStartS,
      fitEndS,
      cycleCount: (fitEndS - fitStartS) * dampedFrequencyHz,
      rSquared: amplitude.rSquared,
      rmsLogResidual: amplitude.rms,
      noiseFloorMPerS2: noiseFloor,
      envelopeMaxMPerS2: envelopeFull[maxIndex],
      timesS,
      envelope,
      fitTimesS,
      fittedEnvelope,
    },
  };
}
