import { z } from 'zod';
import { typeError } from './messages';
import {
  MAX_BODY_WEIGHT_N,
  MAX_DECK_AREA_M2,
  MAX_DENSITY_PER_M2,
  MAX_FORCE_N,
  MAX_WALKING_SPEED_M_PER_S,
  MAX_WEIGHT_N,
  MAX_FREQUENCY_HZ,
  MIN_FREQUENCY_HZ,
  checkTotalMassRatio,
  designWarningSchema,
  directionSchema,
  formatNumber,
  frequencyHzSchema,
  structureModeSchema,
  tmdListSchema,
  tmdSchema,
  tuningMethodSchema,
} from './compute-shapes';

export { designWarningSchema, directionSchema, tuningMethodSchema };
export type { DesignWarning, Direction } from './compute-shapes';

/**
 * Requests and answers of the design compute commands `assess`, `size` and `robustness` (the same JSON through
 * `calc` and POST /api/compute/<command>). SI units, the unit in every field name; every damping ratio is referred
 * to the frequency of the oscillator it belongs to.
 */

const num = () => z.number({ error: typeError('must be a number') }).finite('must be a finite number');
const int = () => z.number({ error: typeError('must be a number') }).int('must be a whole number');
const positive = () => num().positive('must be greater than 0');
const nonNegative = () => num().min(0, 'must be 0 or greater');
const bandHz = () =>
  z
    .tuple([frequencyHzSchema('a frequency of the band'), frequencyHzSchema('a frequency of the band')], { error: typeError('must be a pair [lowHz, highHz] of numbers') })
    .refine(([lo, hi]) => lo <= hi, 'the first frequency must not exceed the second');

/** The structure mode and the damper of every command (compute-shapes.ts): the design commands' names for them. */
export const designStructureSchema = structureModeSchema;
export const designTmdSchema = tmdSchema;

export const crowdGuideSchema = z.enum(['setra', 'hivoss'], { error: typeError('must be "setra" or "hivoss"') });

const harmonicLoadSchema = z.strictObject({
  kind: z.literal('harmonic'),
  modalForceAmplitudeN: positive().max(MAX_FORCE_N, `must be at most ${formatNumber(MAX_FORCE_N)} N (a modal force amplitude)`),
  pacingRangeHz: bandHz(),
});

const gaitFields = {
  pacingRangeHz: bandHz().optional(),
  bodyWeightN: positive().max(MAX_BODY_WEIGHT_N, `must be at most ${formatNumber(MAX_BODY_WEIGHT_N)} N (the body weight of one person)`).optional(),
  /** |φ| where the person walks, for the unit-max mode shape (default 1, the antinode). */
  modeShapeValue: positive().max(1, 'must be at most 1 (the mode shape is scaled to 1 at its maximum)').optional(),
};
const walkerLoadSchema = z.strictObject({ kind: z.literal('walker'), ...gaitFields });
const joggerLoadSchema = z.strictObject({ kind: z.literal('jogger'), ...gaitFields });

const crowdFields = {
  guide: crowdGuideSchema,
  densityPerM2: positive().max(MAX_DENSITY_PER_M2, `must be at most ${MAX_DENSITY_PER_M2} persons/m² (denser than any crowd can stand)`).optional(),
  trafficClass: z.string({ error: typeError('must be a traffic class name') }).optional(),
  deckAreaM2: positive().max(MAX_DECK_AREA_M2, `must be at most ${formatNumber(MAX_DECK_AREA_M2)} m² (a square kilometre of deck)`),
  modeShapeMean: positive().max(1, 'must be at most 1 (mean of |φ| for the unit-max mode shape)').optional(),
  /** Pedestrian force harmonic: 1 (default) or 2 (Sétra 2006 case 3, HiVoSS 2008 second-harmonic ψ). */
  harmonic: z.literal([1, 2], { error: typeError('must be 1 (first harmonic) or 2 (second harmonic)') }).default(1),
};
const crowdLoadSchema = z.strictObject({ kind: z.literal('crowd'), ...crowdFields });
const lateralLoadSchema = z.strictObject({
  kind: z.literal('lateral'),
  ...crowdFields,
  lockInCoefficientNsPerM: positive().optional(),
});

const floorWalkingLoadSchema = z.strictObject({
  kind: z.literal('floor-walking'),
  constantForceN: positive().max(MAX_FORCE_N, `must be at most ${formatNumber(MAX_FORCE_N)} N (a force amplitude)`).optional(),
  stepFrequencyRangeHz: bandHz().optional(),
  harmonicCount: int().min(1, 'must be at least 1').max(6, 'must be at most 6').optional(),
  effectiveWeightN: positive().max(MAX_WEIGHT_N, `must be at most ${formatNumber(MAX_WEIGHT_N)} N (twice the weight of the heaviest modal mass)`).optional(),
});

const movingWalkerLoadSchema = z.strictObject({
  kind: z.literal('moving-walker'),
  spanM: positive(),
  gait: z.enum(['walking', 'jogging'], { error: typeError('must be "walking" or "jogging"') }).optional(),
  pacingFrequencyHz: frequencyHzSchema('a pacing frequency').optional(),
  walkingSpeedMPerS: positive().max(MAX_WALKING_SPEED_M_PER_S, `must be at most ${MAX_WALKING_SPEED_M_PER_S} m/s (faster than any runner)`).optional(),
  bodyWeightN: positive().max(MAX_BODY_WEIGHT_N, `must be at most ${formatNumber(MAX_BODY_WEIGHT_N)} N (the body weight of one person)`).optional(),
  timeStepS: positive().optional(),
  trailingTimeS: nonNegative().optional(),
});

export type MovingWalkerLoadCase = z.infer<typeof movingWalkerLoadSchema>;

const steadyLoadCases = [
  harmonicLoadSchema,
  walkerLoadSchema,
  joggerLoadSchema,
  crowdLoadSchema,
  lateralLoadSchema,
  floorWalkingLoadSchema,
] as const;

const loadCaseError = {
  error: typeError('must have a "kind" of harmonic, walker, jogger, crowd, lateral, floor-walking or moving-walker'),
};
export const loadCaseSchema = z.discriminatedUnion('kind', [...steadyLoadCases, movingWalkerLoadSchema], loadCaseError);
/** Load cases with a steady-state envelope (all but the moving walker), for `size` and `robustness`. */
export const steadyLoadCaseSchema = z.discriminatedUnion('kind', [...steadyLoadCases], {
  error: typeError('must have a "kind" of harmonic, walker, jogger, crowd, lateral or floor-walking'),
});

const criteriaSetsSchema = z.discriminatedUnion(
  'set',
  [
    z.strictObject({ set: z.literal('custom'), peakAccelerationLimitMPerS2: positive() }),
    z.strictObject({ set: z.literal('setra'), class: z.enum(['maximum', 'mean', 'minimum'], { error: typeError('must be "maximum", "mean" or "minimum"') }) }),
    z.strictObject({ set: z.literal('hivoss'), class: z.enum(['CL1', 'CL2', 'CL3'], { error: typeError('must be "CL1", "CL2" or "CL3"') }) }),
    z.strictObject({ set: z.literal('en1990'), class: z.enum(['normal-use', 'crowd'], { error: typeError('must be "normal-use" or "crowd"') }).default('normal-use') }),
    z.strictObject({
      set: z.literal('dg11'),
      class: z.enum(['office', 'shopping-mall', 'indoor-footbridge', 'outdoor-footbridge'], {
        error: typeError('must be "office", "shopping-mall", "indoor-footbridge" or "outdoor-footbridge"'),
      }),
    }),
    z.strictObject({
      set: z.literal('iso10137'),
      class: z.enum(['operating-theatre', 'hospital-ward', 'residential', 'office'], {
        error: typeError('must be "operating-theatre", "hospital-ward", "residential" or "office"'),
      }),
      responseFactor: positive().optional(),
    }),
  ],
  { error: typeError('must be { "peakAccelerationLimitMPerS2" } or have a "set" of setra, hivoss, en1990, dg11, iso10137 or custom') },
);

/**
 * Comfort criteria: `{ "peakAccelerationLimitMPerS2" }` (custom numbers, read as set "custom") or `{ "set", "class" }`.
 */
export const criteriaSchema = z.preprocess(
  (value) =>
    value !== null && typeof value === 'object' && !Array.isArray(value) && !('set' in value) && 'peakAccelerationLimitMPerS2' in value
      ? { set: 'custom', ...value }
      : value,
  criteriaSetsSchema,
);

export const hardwareOptionsSchema = z.strictObject({
  /** Number of equal units the moving mass is split over (default 1). */
  unitCount: int().min(1, 'must be at least 1').max(100, 'must be at most 100').optional(),
  /** Springs in parallel per unit (default 4, one per corner: common practice). */
  springsPerUnit: int().min(1, 'must be at least 1').max(64, 'must be at most 64').optional(),
  /** Design stroke / computed maximum stroke (default 1.5, our choice). */
  strokeMarginFactor: num().min(1, 'must be at least 1').max(10, 'must be at most 10').optional(),
  /** Travel the hardware allows, zero to peak, m (warning when the design stroke exceeds it). */
  strokeLimitM: positive().optional(),
  /** Half-width of the site tuning range as a fraction of the damper frequency (default 0.15). */
  tuningRangeRatio: num().min(0, 'must be 0 or greater').max(0.5, 'must be at most 0.5').optional(),
});
export type HardwareOptions = z.infer<typeof hardwareOptionsSchema>;

function checkLoadCaseAgainstStructure(
  value: { structure: { direction: string }; loadCase: Record<string, unknown> & { kind: string } },
  ctx: z.RefinementCtx,
): void {
  const lc = value.loadCase;
  if (lc.kind === 'crowd' || lc.kind === 'lateral') {
    const hasDensity = lc.densityPerM2 !== undefined;
    const hasClass = lc.trafficClass !== undefined;
    if (hasDensity === hasClass) {
      ctx.addIssue({ code: 'custom', path: ['loadCase', 'densityPerM2'], message: 'give exactly one of densityPerM2 and trafficClass' });
    }
    if (hasClass) {
      const classes = lc.guide === 'setra' ? ['I', 'II', 'III'] : ['TC1', 'TC2', 'TC3', 'TC4', 'TC5'];
      if (!classes.includes(lc.trafficClass as string)) {
        ctx.addIssue({ code: 'custom', path: ['loadCase', 'trafficClass'], message: `must be one of ${classes.join(', ')} for guide ${String(lc.guide)}` });
      }
    }
  }
  if (lc.kind === 'lateral' && value.structure.direction !== 'lateral') {
    ctx.addIssue({ code: 'custom', path: ['structure', 'direction'], message: 'must be "lateral" for a lateral load case' });
  }
  if ((lc.kind === 'floor-walking' || lc.kind === 'moving-walker') && value.structure.direction !== 'vertical') {
    ctx.addIssue({ code: 'custom', path: ['structure', 'direction'], message: `must be "vertical" for a ${lc.kind} load case` });
  }
  // A torsional mode is loaded by the vertical force on its eccentric mode shape; nobody jogs sideways.
  if (lc.kind === 'jogger' && value.structure.direction !== 'vertical' && value.structure.direction !== 'torsional') {
    ctx.addIssue({
      code: 'custom',
      path: ['structure', 'direction'],
      message: 'must be "vertical" or "torsional" for a jogger load case (the Bachmann & Ammann set gives no horizontal jogging force)',
    });
  }
}

/** The checks of a structure and its dampers against a load case: the load case's rules and the dampers' total mass. */
function checkDesignRequest(
  value: { structure: { direction: string; modalMassKg: number }; tmds?: ReadonlyArray<{ massKg: number }>; loadCase: Record<string, unknown> & { kind: string } },
  ctx: z.RefinementCtx,
): void {
  checkLoadCaseAgainstStructure(value, ctx);
  if (value.tmds) checkTotalMassRatio({ structure: value.structure, tmds: value.tmds }, ctx);
}

export const assessRequestSchema = z
  .strictObject({
    structure: designStructureSchema,
    tmds: tmdListSchema().default([]),
    loadCase: loadCaseSchema,
    criteria: criteriaSchema.optional(),
    hardware: hardwareOptionsSchema.optional(),
  })
  .superRefine(checkDesignRequest);
export type AssessRequest = z.infer<typeof assessRequestSchema>;

export const sizeRequestSchema = z
  .strictObject({
    structure: designStructureSchema,
    method: tuningMethodSchema,
    loadCase: steadyLoadCaseSchema,
    peakAccelerationLimitMPerS2: positive(),
    structureFrequencyToleranceRatio: num().min(0, 'must be 0 or greater').max(0.5, 'must be at most 0.5').default(0),
    maxMassRatio: num().gt(0, 'must be greater than 0').max(0.5, 'must be at most 0.5').default(0.25),
    hardware: hardwareOptionsSchema.optional(),
  })
  .superRefine(checkLoadCaseAgainstStructure)
  .superRefine((value, ctx) => {
    const r = value.structureFrequencyToleranceRatio;
    const lo = value.structure.frequencyHz * (1 - r);
    const hi = value.structure.frequencyHz * (1 + r);
    if (lo < MIN_FREQUENCY_HZ || hi > MAX_FREQUENCY_HZ) {
      ctx.addIssue({
        code: 'custom',
        path: ['structureFrequencyToleranceRatio'],
        message: `moves the structure frequency over ${formatNumber(lo)}–${formatNumber(hi)} Hz: it must stay between ${formatNumber(MIN_FREQUENCY_HZ)} and ${formatNumber(MAX_FREQUENCY_HZ)} Hz (a natural frequency)`,
      });
    }
  });
export type SizeRequest = z.infer<typeof sizeRequestSchema>;

/**
 * Largest cells × dampers of one robustness map (each cell is a continuous peak search of a system with every damper):
 * about 1.3 s on the development machine at the heaviest (see docs/engine.md, "Limits of work").
 */
export const MAX_ROBUSTNESS_WORK = 60_000;

const factorList = (what: string) =>
  z
    .array(nonNegative(), { error: typeError(`must be an array of ${what}`) })
    .min(1, 'must hold at least one factor')
    .max(501, 'must hold at most 501 factors');

export const robustnessRequestSchema = z
  .strictObject({
    structure: designStructureSchema,
    tmds: tmdListSchema(1),
    loadCase: steadyLoadCaseSchema,
    structureFrequencyFactors: factorList('structure frequency factors').refine((a) => a.every((v) => v > 0), 'every factor must be greater than 0'),
    tmdDampingFactors: factorList('damper damping factors'),
  })
  .superRefine(checkDesignRequest)
  .superRefine((value, ctx) => {
    value.structureFrequencyFactors.forEach((factor, i) => {
      const f = factor * value.structure.frequencyHz;
      if (factor > 0 && (f < MIN_FREQUENCY_HZ || f > MAX_FREQUENCY_HZ)) {
        ctx.addIssue({
          code: 'custom',
          path: ['structureFrequencyFactors', i],
          message: `moves the structure frequency to ${formatNumber(f)} Hz: it must stay between ${formatNumber(MIN_FREQUENCY_HZ)} and ${formatNumber(MAX_FREQUENCY_HZ)} Hz (a natural frequency)`,
        });
      }
    });
    const cells = value.structureFrequencyFactors.length * value.tmdDampingFactors.length;
    if (cells * value.tmds.length > MAX_ROBUSTNESS_WORK) {
      ctx.addIssue({
        code: 'custom',
        path: ['structureFrequencyFactors'],
        message: `cells × dampers must be at most ${MAX_ROBUSTNESS_WORK.toLocaleString('en-GB')} (got ${value.structureFrequencyFactors.length} × ${value.tmdDampingFactors.length} cells × ${value.tmds.length} dampers = ${(cells * value.tmds.length).toLocaleString('en-GB')}); use fewer factors or dampers, or split the map into several requests`,
      });
    }
    value.tmds.forEach((t, j) => {
      value.tmdDampingFactors.forEach((factor, i) => {
        if (t.dampingRatio * factor >= 1) {
          ctx.addIssue({ code: 'custom', path: ['tmdDampingFactors', i], message: `makes the damping ratio of tmds.${j} reach 1 or more` });
        }
      });
    });
  });
export type RobustnessRequest = z.infer<typeof robustnessRequestSchema>;

// ---- answers ----

export const criterionSchema = z.object({
  set: z.string(),
  class: z.string(),
  label: z.string(),
  source: z.string(),
  limitMPerS2: z.number(),
  atFrequencyHz: z.number(),
  caution: z.string(),
});

export const hardwareEntrySchema = z.object({
  movingMassKg: z.number(),
  frequencyHz: z.number(),
  dampingRatio: z.number(),
  springRateNPerM: z.number(),
  damperCoefficientNsPerM: z.number(),
  staticDeflectionM: z.number(),
  maximumStrokeM: z.number(),
  strokeMarginFactor: z.number(),
  designStrokeM: z.number(),
  strokeLimitM: z.number().nullable(),
  strokeWithinLimit: z.boolean().nullable(),
  unitCount: z.number(),
  springsPerUnit: z.number(),
  perUnit: z.object({
    movingMassKg: z.number(),
    springRateNPerM: z.number(),
    springRatePerSpringNPerM: z.number(),
    damperCoefficientNsPerM: z.number(),
  }),
  tuningRange: z.object({
    ratio: z.number(),
    minFrequencyHz: z.number(),
    maxFrequencyHz: z.number(),
    /** Spring rate of the whole damper at constant moving mass, for the low and high end. */
    minSpringRateNPerM: z.number(),
    maxSpringRateNPerM: z.number(),
    /** Moving mass at constant springs for the high and low end (mass blocks). */
    minMovingMassKg: z.number(),
    maxMovingMassKg: z.number(),
  }),
});
export type HardwareSheetEntry = z.infer<typeof hardwareEntrySchema>;

export const assessResponseSchema = z.object({
  peakAccelerationMPerS2: z.number(),
  atFrequencyHz: z.number(),
  /** null when unbounded: structure damping ratio 0 and its frequency in the loaded band (warning bare-structure-unbounded). */
  bareStructurePeakAccelerationMPerS2: z.number().nullable(),
  bareStructureAtFrequencyHz: z.number(),
  tmdStrokeM: z.array(z.number()),
  tmdStrokeAtFrequencyHz: z.array(z.number()),
  /** Modal force amplitude at the frequency of the peak, N. */
  modalForceAmplitudeN: z.number(),
  equivalentPedestrians: z.number().optional(),
  pedestrianCount: z.number().optional(),
  massRatio: z.number(),
  verdict: z.enum(['pass', 'fail']).optional(),
  utilisation: z.number().optional(),
  bareStructureVerdict: z.enum(['pass', 'fail']).optional(),
  /** null when the bare peak is null (unbounded). */
  bareStructureUtilisation: z.number().nullable().optional(),
  criterion: criterionSchema.optional(),
  comfortClass: z.string().optional(),
  bareStructureComfortClass: z.string().optional(),
  loadModel: z.object({
    kind: z.string(),
    source: z.string(),
    bandsHz: z.array(z.tuple([z.number(), z.number()])),
    structureFrequencyRangeHz: z.tuple([z.number(), z.number()]),
  }),
  lockIn: z
    .object({
      coefficientNsPerM: z.number(),
      expectedPedestrians: z.number(),
      criticalPedestrians: z.number(),
      bareStructureCriticalPedestrians: z.number(),
      lockInExpected: z.boolean(),
      source: z.string(),
    })
    .optional(),
  dg11: z
    .object({
      effectiveWeightN: z.number(),
      constantForceN: z.number(),
      /** null for a damping ratio of 0 (the formula divides by it). */
      formulaPeakAccelerationMPerS2: z.number().nullable(),
    })
    .optional(),
  timeHistory: z
    .object({
      timeStepS: z.number(),
      timesS: z.array(z.number()),
      structureAccelerationMPerS2: z.array(z.number()),
      runningRms1sMPerS2: z.array(z.number()),
      peakAccelerationMPerS2: z.number(),
      maxRunningRms1sMPerS2: z.number(),
      bareStructurePeakAccelerationMPerS2: z.number(),
      bareStructureMaxRunningRms1sMPerS2: z.number(),
      /** null when unbounded: no damping anywhere and the governing harmonic at a natural frequency. */
      steadyStatePeakAccelerationMPerS2: z.number().nullable(),
      governingHarmonicForceN: z.number(),
      governingHarmonicFrequencyHz: z.number(),
      modelRangeHz: z.tuple([z.number(), z.number()]),
      maxTmdStrokeM: z.array(z.number()),
      pacingFrequencyHz: z.number(),
      walkingSpeedMPerS: z.number(),
      crossingTimeS: z.number(),
    })
    .optional(),
  hardware: z.array(hardwareEntrySchema),
  warnings: z.array(designWarningSchema),
  caution: z.string(),
});
export type AssessResponse = z.infer<typeof assessResponseSchema>;

export const sizeResponseSchema = z.object({
  massRatio: z.number(),
  tmd: z.object({ massKg: z.number(), frequencyHz: z.number(), dampingRatio: z.number() }).nullable(),
  worstPeakAccelerationMPerS2: z.number(),
  worstAtStructureFrequencyHz: z.number(),
  /** null when unbounded: structure damping ratio 0 with a structure frequency of the band in the loaded band. */
  bareStructureWorstPeakAccelerationMPerS2: z.number().nullable(),
  structureFrequencyRangeHz: z.tuple([z.number(), z.number()]),
  peakAccelerationLimitMPerS2: z.number(),
  method: tuningMethodSchema,
  /** Largest stroke of the sized damper over the load band and the structure-frequency band, m. */
  tmdStrokeM: z.number().nullable(),
  hardware: hardwareEntrySchema.nullable(),
  evaluations: z.number(),
  warnings: z.array(designWarningSchema),
  caution: z.string(),
});
export type SizeResponse = z.infer<typeof sizeResponseSchema>;

export const robustnessResponseSchema = z.object({
  structureFrequencyFactors: z.array(z.number()),
  tmdDampingFactors: z.array(z.number()),
  /** Row per structure-frequency factor, column per damper-damping factor. */
  peakAccelerationMPerS2: z.array(z.array(z.number())),
  /** Peak of the bare structure per structure-frequency factor; null where unbounded (damping ratio 0, frequency in the loaded band). */
  bareStructurePeakAccelerationMPerS2: z.array(z.number().nullable()),
  warnings: z.array(designWarningSchema),
});
export type RobustnessResponse = z.infer<typeof robustnessResponseSchema>;
