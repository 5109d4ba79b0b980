import { z } from 'zod';
import { maxProjectVersion } from './projects';
import { identificationMethodSchema, identifyResponseSchema } from './identify';
import { tuningMethodSchema } from './compute-shapes';
import { projectParamsSchema } from './model';
import { typeError } from './messages';

/**
 * Site records: a measured acceleration record of a structure (as a CSV file), its `identify` analysis and the
 * comparison with the design mode. The upload is multipart (the file and the fields below as text fields).
 */

/** Largest file accepted, bytes. */
export const SITE_RECORD_MAX_FILE_BYTES = 20 * 1024 * 1024;

export const siteRecordConditions = ['without-damper', 'with-damper', 'damper-locked'] as const;
export const siteRecordConditionSchema = z.enum(siteRecordConditions, { error: typeError(`must be one of ${siteRecordConditions.join(', ')}`) });
export type SiteRecordCondition = z.infer<typeof siteRecordConditionSchema>;

export const siteRecordParamsSchema = projectParamsSchema.extend({ siteRecordId: z.uuid('must be a site record id (UUID)') });

const finite = z.number({ error: typeError('must be a finite number') });
export const bandSchema = z
  .tuple([finite, finite], { error: typeError('must be [low, high] in Hz') })
  .refine(([low, high]) => low > 0 && low < high, { error: 'must be [low, high] with 0 < low < high' });

/** A multipart text field that holds JSON (bandHz). */
const jsonText = <T extends z.ZodType>(schema: T, what: string) =>
  z
    .string()
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: `must be JSON, ${what}` });
        return z.NEVER;
      }
    })
    .pipe(schema);

const blankToUndefined = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? undefined : value);

/** The text fields of the upload (multipart: every value arrives as a string). */
export const uploadSiteRecordFieldsSchema = z.strictObject({
  structureId: z.uuid('must be a structure id (UUID)'),
  modeId: z.preprocess(blankToUndefined, z.uuid('must be a mode id (UUID)').optional()),
  condition: siteRecordConditionSchema,
  method: z.preprocess(blankToUndefined, identificationMethodSchema.optional()),
  bandHz: z.preprocess(blankToUndefined, jsonText(bandSchema, 'e.g. [1, 4]').optional()),
  measuredAt: z.preprocess(blankToUndefined, z.iso.datetime({ offset: true, error: 'must be a date and time (ISO 8601, e.g. 2026-05-04T10:30:00Z)' }).optional()),
  notes: z.preprocess(blankToUndefined, z.string().max(2000, { error: 'must be at most 2000 characters' }).optional()),
  /** Name of an acceleration column, or its 0-based index among them. */
  channel: z.preprocess(blankToUndefined, z.string().max(200).optional()),
  /** Only for a single-column file. */
  sampleRateHz: z.preprocess(
    blankToUndefined,
    z.coerce.number({ error: 'must be a number in Hz' }).positive({ error: 'must be greater than 0' }).max(100_000, { error: 'must be at most 100000 Hz' }).optional(),
  ),
});
export type UploadSiteRecordFields = z.infer<typeof uploadSiteRecordFieldsSchema>;

export const analyseSiteRecordSchema = z.strictObject({
  method: identificationMethodSchema.optional(),
  bandHz: bandSchema.optional(),
  /** The version read; when given, a record changed since gets 409 and is left alone. */
  version: z.number().int().positive().max(maxProjectVersion, `must be at most ${maxProjectVersion}`).optional(),
});
export type AnalyseSiteRecordInput = z.infer<typeof analyseSiteRecordSchema>;

export const retuneRequestSchema = z.strictObject({
  massRatio: finite.gt(0, { error: 'must be greater than 0' }).max(0.5, { error: 'must be at most 0.5' }),
  method: tuningMethodSchema,
  tmdMassKg: finite.gt(0, { error: 'must be greater than 0' }).optional(),
  springRateNPerM: finite.gt(0, { error: 'must be greater than 0' }).optional(),
  tuningRangeRatio: finite.min(0, { error: 'must be at least 0' }).lt(1, { error: 'must be below 1' }).optional(),
});
export type RetuneRequest = z.infer<typeof retuneRequestSchema>;

export const retuneResponseSchema = z.object({
  siteRecordId: z.string(),
  measured: z.object({ frequencyHz: z.number(), dampingRatio: z.number() }),
  method: tuningMethodSchema,
  massRatio: z.number(),
  frequencyRatio: z.number(),
  targetFrequencyHz: z.number(),
  targetDampingRatio: z.number(),
  currentFrequencyHz: z.number().nullable(),
  springRateAtSameMassNPerM: z.number().nullable(),
  springRateChangeRatio: z.number().nullable(),
  massAtSameSpringsKg: z.number().nullable(),
  massChangeRatio: z.number().nullable(),
  frequencyChangeRatio: z.number().nullable(),
  tuningRangeRatio: z.number().nullable(),
  withinTuningRange: z.boolean().nullable(),
});
export type RetuneResponse = z.infer<typeof retuneResponseSchema>;

/**
 * POST …/site-records/:siteRecordId/retuned-variant: a new tuning variant, a copy of `variantId` (a variant on the
 * record's mode, tuned by a method) whose damper is set by hand to what that method gives for the structure as
 * measured. The answer is the new variant (201). Its result is computed on the design mode as stored: the as-built
 * damper checked on the design model.
 */
export const retunedVariantRequestSchema = z.strictObject({
  variantId: z.uuid('must be a tuning variant id (UUID)'),
  /** The new variant's name; by default the original's with the record's file name. */
  name: z
    .string({ error: typeError('must be text') })
    .trim()
    .min(1, 'must not be empty')
    .max(120, 'must be at most 120 characters')
    .refine((value) => !value.includes('\u0000'), 'must not contain a NUL character (\\u0000)')
    .optional(),
});
export type RetunedVariantRequest = z.infer<typeof retunedVariantRequestSchema>;

export const siteRecordComparisonSchema = z.object({
  modeId: z.string(),
  modeLabel: z.string(),
  design: z.object({ frequencyHz: z.number(), dampingRatio: z.number() }),
  measured: z.object({ frequencyHz: z.number().nullable(), dampingRatio: z.number().nullable() }),
  /** (measured − design) / design × 100; null when the analysis found no mode. */
  frequencyShiftPercent: z.number().nullable(),
  dampingShiftPercent: z.number().nullable(),
  /** Only for a with-damper record: measured ζ − reference ζ. */
  addedDamping: z
    .object({
      dampingRatio: z.number(),
      reference: z.enum(['without-damper-record', 'design-mode']),
      referenceDampingRatio: z.number(),
      referenceRecordId: z.string().nullable(),
    })
    .nullable(),
});
export type SiteRecordComparison = z.infer<typeof siteRecordComparisonSchema>;

export const siteRecordSchema = z.object({
  id: z.string(),
  projectId: z.string(),
  structureId: z.string(),
  modeId: z.string().nullable(),
  condition: siteRecordConditionSchema,
  fileName: z.string(),
  fileSizeBytes: z.number(),
  channel: z.string(),
  channelIndex: z.number(),
  channels: z.array(z.string()),
  sampleRateHz: z.number(),
  sampleCount: z.number(),
  measuredAt: z.string().nullable(),
  notes: z.string().nullable(),
  analysis: identifyResponseSchema,
  comparison: siteRecordComparisonSchema.nullable(),
  version: z.number(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type SiteRecord = z.infer<typeof siteRecordSchema>;

export const siteRecordListSchema = z.object({ siteRecords: z.array(siteRecordSchema) });
export type SiteRecordList = z.infer<typeof siteRecordListSchema>;

/** The record's time history for a plot: the chosen channel, thinned to at most this many points (each bucket's lowest and highest sample, in time order). */
export const SITE_RECORD_PLOT_POINTS = 4000;
export const siteRecordTimeHistorySchema = z.object({
  channel: z.string(),
  sampleRateHz: z.number(),
  sampleCount: z.number(),
  /** True when the plot holds fewer points than the record. */
  thinned: z.boolean(),
  timesS: z.array(z.number()),
  accelerationMPerS2: z.array(z.number()),
});
export type SiteRecordTimeHistory = z.infer<typeof siteRecordTimeHistorySchema>;
