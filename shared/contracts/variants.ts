import { z } from 'zod';
import { maxProjectVersion } from './projects';
import { apiErrorSchema } from './errors';
import { typeError } from './messages';
import { projectParamsSchema } from './model';
import {
  assessResponseSchema,
  designWarningSchema,
  hardwareOptionsSchema,
  tuningMethodSchema,
} from './compute-design';
import { dampingRatioSchema, frequencyHzSchema } from './compute-shapes';

export type { HardwareSheetEntry } from './compute-design';
export type TuningMethod = z.infer<typeof tuningMethodSchema>;

/**
 * Tuning variants of a project, as stored and served: a damper of a chosen mass ratio on one of the project's modes,
 * tuned by a published method or by hand, checked under one or more of the project's load cases against one set of
 * comfort criteria. The server computes each variant's result with the engine (shared/compute/variant.ts) and stores
 * it with the hash of its inputs; a read never serves a number computed from inputs that have since changed.
 * SI units, named in every field; every damping ratio is referred to the frequency of the oscillator it belongs to.
 */

/** Text a person types: trimmed, bounded, and without NUL characters (which no text column can store). */
const trimmed = (max: number) =>
  z
    .string({ error: typeError('must be text') })
    .trim()
    .max(max, `must be at most ${max} characters`)
    .refine((value) => !value.includes('\u0000'), 'must not contain a NUL character (\\u0000)');
const num = () => z.number({ error: typeError('must be a number') }).finite('must be a finite number');
const version = z
  .number({ error: typeError('must be the version number you read') })
  .int('must be a whole number')
  .min(1, 'must be at least 1')
  .max(maxProjectVersion, `must be at most ${maxProjectVersion}`);
const uuid = (what: string) => z.uuid(`must be ${what} id (UUID)`);

/** Largest total damper mass of a variant against the mode's modal mass (25 %: beyond it a damper is a second structure). */
export const MAX_VARIANT_MASS_RATIO = 0.25;
/** Most load cases one variant is checked under. */
export const MAX_VARIANT_LOAD_CASES = 20;
/** Default half-width of the detuning band, as a fraction of the structure's frequency (±10 %: common practice). */
export const DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO = 0.1;

export const variantParamsSchema = projectParamsSchema.extend({ variantId: uuid('a variant') });

/** Total damper mass / the mode's modal mass: greater than 0, at most 0.25. */
export const variantMassRatioSchema = num()
  .gt(0, 'must be greater than 0 (the total damper mass as a fraction of the modal mass)')
  .max(MAX_VARIANT_MASS_RATIO, `must be at most ${MAX_VARIANT_MASS_RATIO} (25 % of the modal mass)`);

/** Tuned by a published method: re-tuned whenever the mode changes. */
export const methodTuningSchema = z.strictObject({ method: tuningMethodSchema });
/** Tuned by hand: the damper's own frequency and its damping ratio referred to that frequency; kept when the mode changes. */
export const manualTuningSchema = z.strictObject({
  frequencyHz: frequencyHzSchema("a damper's own frequency"),
  dampingRatio: dampingRatioSchema().gt(0, 'must be greater than 0 (a damper needs damping)'),
});
export const variantTuningSchema = z.union([methodTuningSchema, manualTuningSchema], {
  error: typeError('must be { "method" } or { "frequencyHz", "dampingRatio" }'),
});
export type VariantTuning = z.infer<typeof variantTuningSchema>;
export type ManualTuning = z.infer<typeof manualTuningSchema>;
export type MethodTuning = z.infer<typeof methodTuningSchema>;
export const isManualTuning = (tuning: VariantTuning): tuning is ManualTuning => !('method' in tuning);

/** The hardware sheet's options of a variant: the engine's, less the unit count (the variant's own `unitCount`). */
export const variantHardwareSchema = hardwareOptionsSchema.omit({ unitCount: true });
export type VariantHardware = z.infer<typeof variantHardwareSchema>;

export const variantUnitCountSchema = z
  .number({ error: typeError('must be a whole number') })
  .int('must be a whole number')
  .min(1, 'must be at least 1')
  .max(100, 'must be at most 100');
export const structureFrequencyToleranceRatioSchema = num().min(0, 'must be 0 or greater').max(0.5, 'must be at most 0.5');
/** Half-width of the damper's damping-ratio tolerance, as a fraction of its damping ratio. */
export const tmdDampingToleranceRatioSchema = num().min(0, 'must be 0 or greater').max(0.9, 'must be at most 0.9');

const loadCaseIdsSchema = z
  .array(uuid('a load case'), { error: typeError('must be an array of load case ids') })
  .min(1, 'must hold at least one load case')
  .max(MAX_VARIANT_LOAD_CASES, `must hold at most ${MAX_VARIANT_LOAD_CASES} load cases`)
  .superRefine((ids, ctx) => {
    ids.forEach((id, i) => {
      if (ids.indexOf(id) !== i) ctx.addIssue({ code: 'custom', path: [i], message: 'names a load case already in the list' });
    });
  });

const name = () => trimmed(120).min(1, 'is required');

/** POST …/variants. */
export const createVariantSchema = z.strictObject({
  name: name(),
  modeId: uuid('a mode'),
  loadCaseIds: loadCaseIdsSchema,
  criteriaId: uuid('a comfort criteria'),
  massRatio: variantMassRatioSchema,
  tuning: variantTuningSchema,
  unitCount: variantUnitCountSchema.default(1),
  structureFrequencyToleranceRatio: structureFrequencyToleranceRatioSchema.default(DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO),
  tmdDampingToleranceRatio: tmdDampingToleranceRatioSchema.optional(),
  hardware: variantHardwareSchema.default({}),
  notes: trimmed(4000).optional(),
});
export type CreateVariantInput = z.input<typeof createVariantSchema>;
export type CreateVariantParsed = z.output<typeof createVariantSchema>;

/** PATCH …/variants/:variantId: the version read plus the fields to change; null clears an optional field. */
export const updateVariantSchema = z.strictObject({
  version,
  name: name().optional(),
  modeId: uuid('a mode').optional(),
  loadCaseIds: loadCaseIdsSchema.optional(),
  criteriaId: uuid('a comfort criteria').optional(),
  massRatio: variantMassRatioSchema.optional(),
  tuning: variantTuningSchema.optional(),
  unitCount: variantUnitCountSchema.optional(),
  structureFrequencyToleranceRatio: structureFrequencyToleranceRatioSchema.optional(),
  tmdDampingToleranceRatio: tmdDampingToleranceRatioSchema.nullable().optional(),
  hardware: variantHardwareSchema.optional(),
  notes: trimmed(4000).nullable().optional(),
});
export type UpdateVariantInput = z.input<typeof updateVariantSchema>;
export type UpdateVariantParsed = z.output<typeof updateVariantSchema>;

// ---------- result ----------

/** The whole damper: the units share its mass, spring and damper equally (each unit has the same frequency and ζ). */
export const variantTmdSchema = z.object({ massKg: z.number(), frequencyHz: z.number(), dampingRatio: z.number() });
export type VariantTmd = z.infer<typeof variantTmdSchema>;

/**
 * The moving walker's time history as stored with a result: the answer's figures without its per-step series (the
 * curves route serves those).
 */
const storedTimeHistorySchema = assessResponseSchema.shape.timeHistory.unwrap().omit({
  timesS: true,
  structureAccelerationMPerS2: true,
  runningRms1sMPerS2: true,
});

/** One load case of a result: the engine's `assess` answer for it (same field names), with the load case's id and name. */
export const variantLoadCaseResultSchema = assessResponseSchema.omit({ timeHistory: true }).extend({
  loadCaseId: z.string(),
  name: z.string(),
  timeHistory: storedTimeHistorySchema.optional(),
});
export type VariantLoadCaseResult = z.infer<typeof variantLoadCaseResultSchema>;

export const variantVerdictSchema = z.enum(['pass', 'fail']);

/** The load case with the highest utilisation. */
export const variantGoverningSchema = z.object({
  loadCaseId: z.string(),
  peakAccelerationMPerS2: z.number(),
  utilisation: z.number(),
  verdict: variantVerdictSchema,
});

/**
 * The damper held at its tuning while the structure's frequency moves over f (1 ± structureFrequencyToleranceRatio)
 * (and, when a damping tolerance is given, the damper's damping ratio over ζ (1 ± tmdDampingToleranceRatio)): the worst
 * over the band and over every load case.
 */
export const variantDetuningSchema = z.object({
  structureFrequencyToleranceRatio: z.number(),
  tmdDampingToleranceRatio: z.number().nullable(),
  structureFrequencyRangeHz: z.tuple([z.number(), z.number()]),
  worstPeakAccelerationMPerS2: z.number(),
  worstUtilisation: z.number(),
  verdict: variantVerdictSchema,
  /** Structure frequency where the worst utilisation occurs. */
  atStructureFrequencyHz: z.number(),
  /** Damper damping ratio where it occurs (the tuned one unless a damping tolerance is given). */
  atTmdDampingRatio: z.number(),
  /** Load case where it occurs. */
  loadCaseId: z.string(),
  /** The worst of each load case, in the order of the variant's load cases. */
  loadCases: z.array(
    z.object({
      loadCaseId: z.string(),
      worstPeakAccelerationMPerS2: z.number(),
      worstUtilisation: z.number(),
      atStructureFrequencyHz: z.number(),
      atTmdDampingRatio: z.number(),
    }),
  ),
});
export type VariantDetuning = z.infer<typeof variantDetuningSchema>;

/** What the engine computes for a variant (shared/compute/variant.ts `computeVariantResult`). */
export const variantComputationSchema = z.object({
  tmd: variantTmdSchema,
  massRatio: z.number(),
  unitCount: z.number(),
  loadCases: z.array(variantLoadCaseResultSchema),
  governing: variantGoverningSchema,
  detuning: variantDetuningSchema,
  warnings: z.array(designWarningSchema),
  caution: z.string(),
});
export type VariantComputation = z.infer<typeof variantComputationSchema>;

/** A variant's result as served: the computation with the hash of the inputs it was computed from. */
export const variantResultSchema = variantComputationSchema.extend({
  /**
   * False for every result but one: a result whose inputs or engine version changed is recomputed before it is read,
   * except an approved (frozen) design's, which is served as approved; it is true when the engine version that
   * computed it (`engineVersion`) is not the running one (docs/decisions/0019-sign-off-freeze.md).
   */
  stale: z.boolean(),
  inputsHash: z.string(),
  engineVersion: z.string(),
  computedAt: z.string(),
});
export type VariantResult = z.infer<typeof variantResultSchema>;

export const variantSchema = z.object({
  id: z.string(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  createdBy: z.string().nullable(),
  projectId: z.string(),
  name: z.string(),
  modeId: z.string(),
  loadCaseIds: z.array(z.string()),
  criteriaId: z.string(),
  massRatio: z.number(),
  tuning: variantTuningSchema,
  unitCount: z.number().int(),
  structureFrequencyToleranceRatio: z.number(),
  tmdDampingToleranceRatio: z.number().nullable(),
  hardware: variantHardwareSchema,
  notes: z.string().nullable(),
  /**
   * null only when the engine refuses the variant's current inputs (a mode, load case or criteria changed since into
   * a combination the engine does not accept); `resultError` then says why, naming the field.
   */
  result: variantResultSchema.nullable(),
  resultError: apiErrorSchema.shape.error.nullable(),
});
export type Variant = z.infer<typeof variantSchema>;
export const variantListSchema = z.object({ variants: z.array(variantSchema) });
export type VariantList = z.infer<typeof variantListSchema>;

// ---------- size ----------

/** POST …/variants/:variantId/size: `{}` answers only; `{ "apply": true, "version" }` also stores the mass ratio found. */
export const sizeVariantSchema = z
  .strictObject({
    apply: z.boolean({ error: typeError('must be true or false') }).default(false),
    version: version.optional(),
  })
  .superRefine((value, ctx) => {
    if (value.apply && value.version === undefined) ctx.addIssue({ code: 'custom', path: ['version'], message: 'is required to apply the mass ratio (the version you read)' });
  });
export type SizeVariantInput = z.input<typeof sizeVariantSchema>;

export const variantSizeSchema = z.object({
  /** The smallest mass ratio meeting the criteria on every load case over the detuning band; 0 when the bare structure already does. */
  massRatio: z.number(),
  /** The damper at that mass ratio, tuned by the variant's method; null when no damper is needed. */
  tmd: variantTmdSchema.nullable(),
  method: tuningMethodSchema,
  worstPeakAccelerationMPerS2: z.number(),
  worstUtilisation: z.number(),
  atStructureFrequencyHz: z.number(),
  /** The load case that governs at that mass ratio. */
  governingLoadCaseId: z.string(),
  structureFrequencyRangeHz: z.tuple([z.number(), z.number()]),
  evaluations: z.number(),
  warnings: z.array(designWarningSchema),
  caution: z.string(),
  applied: z.boolean(),
  /** The variant after the change, when applied. */
  variant: variantSchema.optional(),
});
export type VariantSize = z.infer<typeof variantSizeSchema>;

// ---------- curves ----------

export const variantCurvesQuerySchema = z.object({ loadCaseId: uuid('a load case') });

/**
 * One force band of the load case (a harmonic of a gait, a guide's crowd band …): response with and without the damper
 * and the damper's stroke at each force frequency, sampled where the curves bend. A value that is unbounded (the
 * bare structure without damping at its resonance) is null.
 */
export const variantResponseBandSchema = z.object({
  label: z.string(),
  loHz: z.number(),
  hiHz: z.number(),
  frequencyHz: z.array(z.number()),
  accelerationMPerS2: z.array(z.number()),
  bareStructureAccelerationMPerS2: z.array(z.number().nullable()),
  tmdStrokeM: z.array(z.number()),
  /** The comfort limit at each frequency, for criteria whose limit depends on frequency (ISO 10137); absent otherwise. */
  limitMPerS2: z.array(z.number()).optional(),
});
export type VariantResponseBand = z.infer<typeof variantResponseBandSchema>;

export const variantRobustnessMapSchema = z.object({
  /** Structure frequencies of the rows, Hz (factor × the mode's frequency). */
  structureFrequencyHz: z.array(z.number()),
  /** Damper damping ratios of the columns (factor × the tuned one). */
  tmdDampingRatio: z.array(z.number()),
  /** Row per structure frequency, column per damper damping ratio, m/s². */
  peakAccelerationMPerS2: z.array(z.array(z.number())),
  bareStructurePeakAccelerationMPerS2: z.array(z.number().nullable()),
  /** The comfort limit at the peak's frequency (constant for the limits that do not depend on frequency). */
  limitMPerS2: z.number(),
});
export type VariantRobustnessMap = z.infer<typeof variantRobustnessMapSchema>;

export const variantTimeHistorySchema = z.object({
  timesS: z.array(z.number()),
  structureAccelerationMPerS2: z.array(z.number()),
  bareStructureAccelerationMPerS2: z.array(z.number()),
  runningRms1sMPerS2: z.array(z.number()),
  /** Every how many time steps of the simulation a point was kept (the largest |value| of each stretch is kept). */
  decimation: z.number(),
  peakAccelerationMPerS2: z.number(),
  bareStructurePeakAccelerationMPerS2: z.number(),
});
export type VariantTimeHistory = z.infer<typeof variantTimeHistorySchema>;

export const variantCurvesSchema = z.object({
  loadCaseId: z.string(),
  name: z.string(),
  kind: z.string(),
  tmd: variantTmdSchema,
  /** Steady-state response over the load's force bands; empty for a moving walker. */
  response: z.array(variantResponseBandSchema),
  peak: z.object({ frequencyHz: z.number(), accelerationMPerS2: z.number() }).nullable(),
  bareStructurePeak: z.object({ frequencyHz: z.number(), accelerationMPerS2: z.number().nullable() }).nullable(),
  limitMPerS2: z.number(),
  /** Steady load cases only. */
  robustness: variantRobustnessMapSchema.nullable(),
  /** Moving-walker load cases only. */
  timeHistory: variantTimeHistorySchema.nullable(),
});
export type VariantCurves = z.infer<typeof variantCurvesSchema>;
