import { z } from 'zod';
import {
  checkRecordAgainstBand,
  checkSampleRate,
  checkSamples,
  identificationMethods,
  MAX_SAMPLE_RATE_HZ,
  MAX_SAMPLES,
  MIN_PERIODS,
  MIN_SAMPLES,
} from '../engine/signal/identify';
import { typeError } from './messages';

/**
 * Request and answer of the `identify` compute command (`calc identify`, POST /api/compute/identify): the as-built
 * frequency and damping ratio of one mode from a site record of acceleration. SI units, named in every field.
 */

export { MAX_SAMPLES as IDENTIFY_MAX_SAMPLES, MIN_SAMPLES as IDENTIFY_MIN_SAMPLES, MIN_PERIODS as IDENTIFY_MIN_PERIODS };

const finite = z.number({ error: typeError('must be a finite number') });

/** An array checked in one pass (a record may hold millions of samples): finite entries, 64 to 2²² of them. */
const samplesSchema = z
  .custom<number[]>((value) => Array.isArray(value), { error: typeError('must be an array of accelerations in m/s², one per sample') })
  .superRefine((value, ctx) => {
    for (const issue of checkSamples(value)) {
      const [, index] = issue.path.split('.');
      ctx.addIssue({ code: 'custom', path: index === undefined ? [] : [Number(index)], message: issue.message.slice(issue.message.indexOf(':') + 2) });
    }
  });

export const identificationMethodSchema = z.enum(identificationMethods, { error: typeError('must be "spectrum" (ambient response) or "decay" (free decay)') });

export const identifyRequestSchema = z
  .strictObject({
    sampleRateHz: finite
      .gt(0, { error: 'must be greater than 0' })
      .max(MAX_SAMPLE_RATE_HZ, { error: `must be at most ${MAX_SAMPLE_RATE_HZ} Hz` }),
    accelerationMPerS2: samplesSchema,
    bandHz: z.tuple([finite, finite], { error: typeError('must be [low, high] in Hz') }).optional(),
    method: identificationMethodSchema.optional(),
  })
  .superRefine((value, ctx) => {
    // A sample rate refused above (this check runs after refusals that do not stop the parse) is not used again.
    if (checkSampleRate(value.sampleRateHz).length > 0) return;
    for (const issue of checkRecordAgainstBand(value.sampleRateHz, value.accelerationMPerS2.length, value.bandHz)) {
      ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message.slice(issue.message.indexOf(':') + 2) });
    }
  });

const band = z.tuple([z.number(), z.number()]);

export const identifyResponseSchema = z.object({
  /** Natural frequency of the mode, or null when the record shows no clear mode in the band (see warnings). */
  frequencyHz: z.number().nullable(),
  /** Its damping ratio (referred to its own frequency), or null with a warning. */
  dampingRatio: z.number().nullable(),
  method: identificationMethodSchema,
  /** "request" when the request named the method, "record" when the command chose it from the record. */
  methodChosenBy: z.enum(['request', 'record']),
  methodNote: z.string(),
  bandHz: band,
  sampleCount: z.number(),
  durationS: z.number(),
  /** Largest |a − mean| and the RMS of a − mean over the whole record. */
  peakAccelerationMPerS2: z.number(),
  rmsAccelerationMPerS2: z.number(),
  spectrum: z.object({
    frequencyHz: z.array(z.number()),
    psdM2PerS4PerHz: z.array(z.number()),
    resolutionHz: z.number(),
    segmentSampleCount: z.number(),
    segmentDurationS: z.number(),
    segmentCount: z.number(),
    window: z.literal('hann'),
    overlapRatio: z.number(),
    /** Largest line in the band, refined by a parabola through the logarithms; null without a clear peak. */
    peakFrequencyHz: z.number().nullable(),
    /** Peak over the band's median, in dB. */
    peakProminenceDb: z.number().nullable(),
  }),
  /** Half-power bandwidth of the spectrum (method "spectrum"; null otherwise or when the peak has no two half-power points): a cross-check, biased high when it spans few lines. */
  halfPower: z
    .object({ lowerHz: z.number(), upperHz: z.number(), dampingRatio: z.number(), bandwidthLines: z.number() })
    .nullable(),
  /** Least-squares fit of one mode's response shape to the spectrum (method "spectrum"). */
  spectrumFit: z
    .object({
      frequencyHz: z.number(),
      dampingRatio: z.number(),
      peakPsdM2PerS4PerHz: z.number(),
      backgroundPsdM2PerS4PerHz: z.number(),
      fitBandHz: band,
      lineCount: z.number(),
      iterations: z.number(),
      rmsLogResidual: z.number(),
      rSquared: z.number(),
      curve: z.object({ frequencyHz: z.array(z.number()), psdM2PerS4PerHz: z.array(z.number()) }),
    })
    .nullable(),
  /** Free-decay fit (method "decay"): the envelope for a plot and the fitted exponential over the part used. */
  decay: z
    .object({
      filterBandHz: band,
      timesS: z.array(z.number()),
      envelopeMPerS2: z.array(z.number()),
      fit: z
        .object({
          frequencyHz: z.number(),
          dampedFrequencyHz: z.number(),
          dampingRatio: z.number(),
          decayRatePerS: z.number(),
          logarithmicDecrement: z.number(),
          startS: z.number(),
          endS: z.number(),
          cycleCount: z.number(),
          rSquared: z.number(),
          rmsLogResidual: z.number(),
          noiseFloorMPerS2: z.number(),
          timesS: z.array(z.number()),
          envelopeMPerS2: z.array(z.number()),
        })
        .nullable(),
    })
    .optional(),
  warnings: z.array(z.string()),
});

export type IdentifyRequest = z.infer<typeof identifyRequestSchema>;
export type IdentifyResponse = z.infer<typeof identifyResponseSchema>;
