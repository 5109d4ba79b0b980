import { EngineInputError } from '../linalg';
import { fitFreeDecay, type DecayResult } from './decay';
import { designBandPass, filterZeroPhase } from './filter';
import { findHalfPower, findSpectrumPeak, fitSingleMode, type HalfPower, type SingleModeFit, type SpectrumPeak } from './fit-spectrum';
import { chooseSegmentLength, MIN_SEGMENTS, welchPsd, type WelchSpectrum } from './welch';

/**
 * As-built frequency and damping of one mode from a site record of acceleration: either from the spectrum of an
 * ambient response (`spectrum`) or from a free decay (`decay`). See docs/engine.md, "Site records".
 */

export const identificationMethods = ['spectrum', 'decay'] as const;
export type IdentificationMethod = (typeof identificationMethods)[number];

/** Longest record accepted (2²² samples: 11.6 h at 100 Hz). */
export const MAX_SAMPLES = 2 ** 22;
/** Shortest record accepted, in samples. */
export const MIN_SAMPLES = 64;
/** A record must span at least this many periods of the band's lower edge. */
export const MIN_PERIODS = 10;
/** Default band when none is given: 0.5 Hz (below lateral pedestrian modes) to 15 Hz or 0.45 f_s (common practice). */
export const DEFAULT_BAND_LOW_HZ = 0.5;
export const DEFAULT_BAND_HIGH_HZ = 15;
/** Highest sampling rate accepted. */
export const MAX_SAMPLE_RATE_HZ = 100_000;
/** Automatic choice: a record whose band-passed RMS falls by this factor (12 dB) from its strongest eighth to its last eighth is a free decay. */
export const DECAY_DROP_RATIO = 4;
/** The spectrum of a free decay spans at most this many periods of the band's lower edge from the strongest sample. */
export const DECAY_SPECTRUM_PERIODS = 200;

export interface IdentifyOptions {
  bandHz?: readonly [number, number];
  method?: IdentificationMethod;
}

export interface InputIssue {
  path: string;
  message: string;
}

/** The band used for a record: the given one, or the default. */
export function identificationBand(sampleRateHz: number, bandHz?: readonly [number, number]): [number, number] {
  return bandHz ? [bandHz[0], bandHz[1]] : [DEFAULT_BAND_LOW_HZ, Math.min(DEFAULT_BAND_HIGH_HZ, 0.45 * sampleRateHz)];
}

/** sampleRateHz: finite and in (0, 100 kHz]. */
export function checkSampleRate(sampleRateHz: unknown): InputIssue[] {
  const ok = typeof sampleRateHz === 'number' && Number.isFinite(sampleRateHz) && sampleRateHz > 0 && sampleRateHz <= MAX_SAMPLE_RATE_HZ;
  return ok ? [] : [{ path: 'sampleRateHz', message: `sampleRateHz: must be a finite number greater than 0 and at most ${MAX_SAMPLE_RATE_HZ} Hz (got ${String(sampleRateHz)})` }];
}

/** accelerationMPerS2: 64 to 2²² samples, every one finite (the first five bad ones named by index, then a count). */
export function checkSamples(samples: ArrayLike<unknown>): InputIssue[] {
  const issues: InputIssue[] = [];
  const n = samples.length;
  if (n > MAX_SAMPLES) {
    return [{ path: 'accelerationMPerS2', message: `accelerationMPerS2: must have at most ${MAX_SAMPLES} samples (got ${n}); split the record` }];
  }
  if (n < MIN_SAMPLES) issues.push({ path: 'accelerationMPerS2', message: `accelerationMPerS2: must have at least ${MIN_SAMPLES} samples (got ${n})` });
  let bad = 0;
  for (let i = 0; i < n; i++) {
    const value = samples[i];
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      if (bad < 5) {
        const shown = value === undefined ? 'nothing' : typeof value === 'number' ? String(value) : JSON.stringify(value);
        issues.push({ path: `accelerationMPerS2.${i}`, message: `accelerationMPerS2.${i}: must be a finite number in m/s² (got ${shown})` });
      }
      bad++;
    }
  }
  if (bad > 5) issues.push({ path: 'accelerationMPerS2', message: `accelerationMPerS2: ${bad} samples are not finite numbers (the first 5 are named)` });
  return issues;
}

/**
 * The band against the sampling rate (0 < low < high < Nyquist; the default band needs f_s above 1.1 Hz) and the
 * record's length against the band: at least 10 periods of its lower edge. `sampleCount` out of range is not
 * checked again here.
 */
export function checkRecordAgainstBand(sampleRateHz: number, sampleCount: number, bandHz?: readonly number[]): InputIssue[] {
  const nyquistHz = sampleRateHz / 2;
  let band: [number, number];
  if (bandHz !== undefined) {
    const [lo, hi] = bandHz;
    if (bandHz.length !== 2 || !(lo > 0) || !(hi > lo) || !(hi < nyquistHz)) {
      return [
        {
          path: 'bandHz',
          message: `bandHz: must be [low, high] with 0 < low < high < the Nyquist frequency ${nyquistHz} Hz (half of sampleRateHz) (got ${JSON.stringify(bandHz)})`,
        },
      ];
    }
    band = [lo, hi];
  } else {
    band = identificationBand(sampleRateHz);
    if (!(band[1] > band[0])) {
      return [{ path: 'sampleRateHz', message: `sampleRateHz: ${sampleRateHz} Hz is too low for the default band from ${DEFAULT_BAND_LOW_HZ} Hz; give bandHz or sample faster` }];
    }
  }
  if (sampleCount < MIN_SAMPLES || sampleCount > MAX_SAMPLES) return [];
  const durationS = sampleCount / sampleRateHz;
  const neededS = MIN_PERIODS / band[0];
  if (durationS >= neededS) return [];
  return [
    {
      path: 'accelerationMPerS2',
      message: `accelerationMPerS2: the record lasts ${durationS.toPrecision(4)} s, shorter than ${MIN_PERIODS} periods of the band's lower edge ${band[0]} Hz (${neededS.toPrecision(4)} s = ${Math.ceil(neededS * sampleRateHz)} samples)`,
    },
  ];
}

/** Every reason to refuse a record, with the request's field names (used by `identifyMode`; the contract runs the same checks). */
export function checkIdentifyInput(sampleRateHz: unknown, samples: ArrayLike<unknown>, bandHz?: readonly number[]): InputIssue[] {
  const rate = checkSampleRate(sampleRateHz);
  const sampleIssues = checkSamples(samples);
  if (rate.length > 0) return [...rate, ...sampleIssues];
  return [...sampleIssues, ...checkRecordAgainstBand(sampleRateHz as number, samples.length, bandHz)];
}

export interface IdentifyResult {
  method: IdentificationMethod;
  methodChosenBy: 'request' | 'record';
  methodNote: string;
  bandHz: [number, number];
  frequencyHz: number | null;
  dampingRatio: number | null;
  sampleCount: number;
  durationS: number;
  peakAccelerationMPerS2: number;
  rmsAccelerationMPerS2: number;
  spectrum: WelchSpectrum;
  peak: SpectrumPeak | null;
  halfPower: HalfPower | null;
  spectrumFit: SingleModeFit | null;
  decay: DecayResult | null;
  warnings: string[];
}

/** RMS of the band-passed record in eight blocks: decay when the strongest block is in the first half and the last one is 12 dB down. */
function chooseMethod(record: Float64Array, sampleRateHz: number, bandHz: [number, number]): { method: IdentificationMethod; note: string } {
  const filter = designBandPass(bandHz[0], Math.min(bandHz[1], 0.95 * (sampleRateHz / 2)), sampleRateHz);
  const filtered = filterZeroPhase(filter, record, sampleRateHz);
  const blocks = 8;
  const size = Math.floor(filtered.length / blocks);
  const rms = new Float64Array(blocks);
  for (let b = 0; b < blocks; b++) {
    let sum = 0;
    for (let i = b * size; i < (b + 1) * size; i++) sum += filtered[i] * filtered[i];
    rms[b] = Math.sqrt(sum / size);
  }
  let strongest = 0;
  for (let b = 1; b < blocks; b++) if (rms[b] > rms[strongest]) strongest = b;
  const dropDb = 20 * Math.log10(rms[strongest] / rms[blocks - 1]);
  const isDecay = strongest < blocks / 2 && rms[strongest] >= DECAY_DROP_RATIO * rms[blocks - 1];
  const dropText = Number.isFinite(dropDb) ? `${dropDb.toFixed(1)} dB` : 'to nothing';
  return isDecay
    ? { method: 'decay', note: `chosen from the record: its response in the band falls by ${dropText} from its strongest eighth (number ${strongest + 1} of 8) to its last eighth, as a free decay does` }
    : { method: 'spectrum', note: `chosen from the record: its response in the band does not die away (its strongest eighth, number ${strongest + 1} of 8, is ${dropText} above its last eighth), as an ambient response does` };
}

/** Identifies the frequency and damping ratio of the clearest mode in the band. `record` is acceleration in m/s². */
export function identifyMode(record: Float64Array, sampleRateHz: number, options: IdentifyOptions = {}): IdentifyResult {
  const issues = checkIdentifyInput(sampleRateHz, record, options.bandHz);
  if (issues.length > 0) throw new EngineInputError(issues[0].path, issues[0].message);
  const n = record.length;
  const bandHz = identificationBand(sampleRateHz, options.bandHz);
  const warnings: string[] = [];

  let mean = 0;
  for (let i = 0; i < n; i++) mean += record[i];
  mean /= n;
  const centred = new Float64Array(n);
  let peakAcceleration = 0;
  let sumSquares = 0;
  for (let i = 0; i < n; i++) {
    const a = record[i] - mean;
    centred[i] = a;
    peakAcceleration = Math.max(peakAcceleration, Math.abs(a));
    sumSquares += a * a;
  }

  // Constant to rounding: what is left after removing the mean is below 1e-12 of the mean.
  const constant = peakAcceleration <= 1e-12 * Math.abs(mean);
  const { method, note } = options.method
    ? { method: options.method, note: 'as requested' }
    : constant
      ? { method: 'spectrum' as const, note: 'the record is constant, so there is nothing to choose from' }
      : chooseMethod(centred, sampleRateHz, bandHz);

  // First spectrum: fine enough for the band's lower edge, as long as sixteen segments fit (four for a free decay,
  // whose spectrum only locates the mode and shows it; the phase of the decay gives the frequency).
  // A free decay's spectrum is taken from its strongest sample on, over at most 200 periods of the band's lower edge,
  // so that a long quiet record around one heel drop does not bury the mode.
  let analysed = centred;
  if (method === 'decay') {
    let strongest = 0;
    for (let i = 1; i < n; i++) if (Math.abs(centred[i]) > Math.abs(centred[strongest])) strongest = i;
    const length = Math.max(MIN_SAMPLES, Math.ceil((DECAY_SPECTRUM_PERIODS * sampleRateHz) / bandHz[0]));
    const from = Math.max(0, Math.min(strongest, n - length));
    analysed = centred.subarray(from, Math.min(n, from + length));
  }
  const minSegments = method === 'spectrum' ? 2 * MIN_SEGMENTS : MIN_SEGMENTS / 2;
  let spectrum = welchPsd(analysed, sampleRateHz, chooseSegmentLength(analysed.length, sampleRateHz, bandHz[0], { minSegments }));
  let search = findSpectrumPeak(spectrum.frequencyHz, spectrum.psd, bandHz);
  let peak: SpectrumPeak | null = null;
  let halfPower: HalfPower | null = null;
  let spectrumFit: SingleModeFit | null = null;
  let decay: DecayResult | null = null;
  let frequencyHz: number | null = null;
  let dampingRatio: number | null = null;
  let startDampingRatio = 0;

  if (method === 'spectrum' && search.found) {
    // Second spectrum: segments as long as needed for the half-power bandwidth 2ζf of the damping a first fit finds
    // to span two lines, and no longer, so that as many segments as possible are averaged (the fit accounts for the
    // window's smoothing, so two lines leave ζ unbiased; see fitSingleMode).
    const first = search.peak;
    const firstHalfPower = findHalfPower(spectrum.frequencyHz, spectrum.psd, first, bandHz);
    const firstFit = fitSingleMode(spectrum.frequencyHz, spectrum.psd, first, bandHz, firstHalfPower?.dampingRatio ?? 0);
    startDampingRatio = firstFit?.dampingRatio ?? 0;
    const segmentLength = chooseSegmentLength(n, sampleRateHz, first.frequencyHz, firstFit ? { referenceDampingRatio: firstFit.dampingRatio } : {});
    if (segmentLength !== spectrum.segmentLength) {
      spectrum = welchPsd(centred, sampleRateHz, segmentLength);
      search = findSpectrumPeak(spectrum.frequencyHz, spectrum.psd, bandHz);
    }
  }
  if (constant) {
    warnings.push('The record is constant (every sample the same): there is no vibration to identify; no frequency or damping is reported.');
  } else if (!search.found) {
    warnings.push(`${search.reason}; no frequency or damping is reported.`);
  } else {
    peak = search.peak;
    if (method === 'spectrum') {
      // The half-power cross-check belongs to a stationary response; a decay's is shaped by where it lies in the segments.
      halfPower = findHalfPower(spectrum.frequencyHz, spectrum.psd, peak, bandHz);
      spectrumFit = fitSingleMode(spectrum.frequencyHz, spectrum.psd, peak, bandHz, startDampingRatio || (halfPower?.dampingRatio ?? 0));
      if (!spectrumFit) {
        warnings.push('The single-mode fit to the spectrum broke down: the peak does not look like one mode (a pure tone, say); no frequency or damping is reported.');
      } else if (spectrumFit.atBound) {
        warnings.push(
          `The single-mode fit ended on a limit of its search (f = ${spectrumFit.naturalFrequencyHz.toPrecision(5)} Hz, ζ = ${spectrumFit.dampingRatio.toPrecision(3)}): the peak does not look like one mode; no frequency or damping is reported.`,
        );
      } else {
        frequencyHz = spectrumFit.naturalFrequencyHz;
        dampingRatio = spectrumFit.dampingRatio;
        const lines = (2 * spectrumFit.dampingRatio * spectrumFit.naturalFrequencyHz) / spectrum.resolutionHz;
        // The fit models the window's smoothing and stays unbiased down to about one line per bandwidth.
        if (lines < 1) {
          warnings.push(
            `The spectral resolution ${spectrum.resolutionHz.toPrecision(3)} Hz is coarse for this damping: the half-power bandwidth 2ζf spans ${lines.toFixed(1)} lines (1 or more wanted); a longer record gives a surer ζ.`,
          );
        }
        if (spectrum.segmentCount < 8) {
          warnings.push(`Only ${spectrum.segmentCount} segments were averaged (8 or more wanted): the spectrum is noisy; a longer record gives a surer ζ.`);
        }
        if (spectrumFit.rSquared < 0.8) {
          warnings.push(`The single-mode shape fits the spectrum poorly (R² = ${spectrumFit.rSquared.toFixed(2)} on the logarithms): a second mode or a narrow-band excitation may be near; check the plot.`);
        }
      }
    } else {
      decay = fitFreeDecay(centred, sampleRateHz, peak.frequencyHz, bandHz);
      if (decay.found) {
        frequencyHz = decay.fit.naturalFrequencyHz;
        dampingRatio = decay.fit.dampingRatio;
        if (decay.fit.rSquared < 0.95) {
          warnings.push(`The logarithm of the envelope is not a straight line (R² = ${decay.fit.rSquared.toFixed(3)}): beating of two close modes or amplitude-dependent damping; check the plot.`);
        }
      } else {
        warnings.push(`${decay.reason}; no frequency or damping is reported.`);
      }
    }
  }
  if (method === 'decay' && !options.method && decay && !decay.found) {
    warnings.push('The record was taken as a free decay; if it is an ambient response, ask for method "spectrum".');
  }
  return {
    method,
    methodChosenBy: options.method ? 'request' : 'record',
    methodNote: note,
    bandHz,
    frequencyHz,
    dampingRatio,
    sampleCount: n,
    durationS: n / sampleRateHz,
    peakAccelerationMPerS2: peakAcceleration,
    rmsAccelerationMPerS2: Math.sqrt(sumSquares / n),
    spectrum,
    peak,
    halfPower,
    spectrumFit,
    decay,
    warnings,
  };
}
