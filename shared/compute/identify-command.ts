import type { ComputeCommand } from './types';
import { ComputeInputError } from './types';
import { identifyRequestSchema, identifyResponseSchema, type IdentifyRequest, type IdentifyResponse } from '../contracts/identify';
import { EngineInputError } from '../engine/linalg';
import { identifyMode } from '../engine/signal/identify';

/** The answer's spectrum runs from 0 Hz to twice the band's upper edge (at most Nyquist): enough to see the band in context. */
const SPECTRUM_SPAN_FACTOR = 2;

const list = (values: Float64Array) => Array.from(values);

export const identifyCommand: ComputeCommand<IdentifyRequest, IdentifyResponse> = {
  name: 'identify',
  summary: 'Frequency and damping ratio of a mode from a site record of acceleration: spectrum (ambient) or decay (free decay).',
  request: identifyRequestSchema,
  response: identifyResponseSchema,
  run(request) {
    let result: ReturnType<typeof identifyMode>;
    try {
      result = identifyMode(Float64Array.from(request.accelerationMPerS2), request.sampleRateHz, { bandHz: request.bandHz, method: request.method });
    } catch (error) {
      if (error instanceof EngineInputError) throw new ComputeInputError(error.message, [{ path: error.field, message: error.message }]);
      throw error;
    }
    const { spectrum, peak, halfPower, spectrumFit, decay } = result;
    const topHz = SPECTRUM_SPAN_FACTOR * result.bandHz[1];
    let lines = 0;
    while (lines < spectrum.frequencyHz.length && spectrum.frequencyHz[lines] <= topHz) lines++;
    const answer: IdentifyResponse = {
      frequencyHz: result.frequencyHz,
      dampingRatio: result.dampingRatio,
      method: result.method,
      methodChosenBy: result.methodChosenBy,
      methodNote: result.methodNote,
      bandHz: result.bandHz,
      sampleCount: result.sampleCount,
      durationS: result.durationS,
      peakAccelerationMPerS2: result.peakAccelerationMPerS2,
      rmsAccelerationMPerS2: result.rmsAccelerationMPerS2,
      spectrum: {
        frequencyHz: list(spectrum.frequencyHz.subarray(0, lines)),
        psdM2PerS4PerHz: list(spectrum.psd.subarray(0, lines)),
        resolutionHz: spectrum.resolutionHz,
        segmentSampleCount: spectrum.segmentLength,
        segmentDurationS: spectrum.segmentLength / request.sampleRateHz,
        segmentCount: spectrum.segmentCount,
        window: 'hann',
        overlapRatio: 0.5,
        peakFrequencyHz: peak ? peak.frequencyHz : null,
        peakProminenceDb: peak ? 10 * Math.log10(peak.prominence) : null,
      },
      halfPower: halfPower ? { ...halfPower } : null,
      spectrumFit: spectrumFit
        ? {
            frequencyHz: spectrumFit.naturalFrequencyHz,
            dampingRatio: spectrumFit.dampingRatio,
            peakPsdM2PerS4PerHz: spectrumFit.peakPsd,
            backgroundPsdM2PerS4PerHz: spectrumFit.backgroundPsd,
            fitBandHz: spectrumFit.fitBandHz,
            lineCount: spectrumFit.pointCount,
            iterations: spectrumFit.iterations,
            rmsLogResidual: spectrumFit.rmsLogResidual,
            rSquared: spectrumFit.rSquared,
            curve: { frequencyHz: list(spectrumFit.frequencyHz), psdM2PerS4PerHz: list(spectrumFit.fittedPsd) },
          }
        : null,
      warnings: result.warnings,
    };
    if (decay) {
      if (decay.found) {
        const fit = decay.fit;
        answer.decay = {
          filterBandHz: fit.filterBandHz,
          timesS: list(fit.timesS),
          envelopeMPerS2: list(fit.envelope),
          fit: {
            frequencyHz: fit.naturalFrequencyHz,
            dampedFrequencyHz: fit.dampedFrequencyHz,
            dampingRatio: fit.dampingRatio,
            decayRatePerS: fit.decayRatePerS,
            logarithmicDecrement: fit.logarithmicDecrement,
            startS: fit.fitStartS,
            endS: fit.fitEndS,
            cycleCount: fit.cycleCount,
            rSquared: fit.rSquared,
            rmsLogResidual: fit.rmsLogResidual,
            noiseFloorMPerS2: fit.noiseFloorMPerS2,
            timesS: list(fit.fitTimesS),
            envelopeMPerS2: list(fit.fittedEnvelope),
          },
        };
      } else {
        answer.decay = { filterBandHz: decay.plot.filterBandHz, timesS: list(decay.plot.timesS), envelopeMPerS2: list(decay.plot.envelope), fit: null };
      }
    }
    return answer;
  },
};
