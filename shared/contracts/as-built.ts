import { z } from 'zod';
import { typeError } from './messages';
import { signOffParamsSchema } from './sign-offs';
import type { Role } from './roles';

/**
 * As-built records of a damper whose design the owner approved: per unit the measured moving mass and, when known,
 * the spring rate and the tuned frequency; each record is kept (a re-measurement after an adjustment is a new record)
 * and answered with its comparison against the hardware sheet (shared/compute/as-built.ts,
 * docs/decisions/0021-as-built-records.md).
 */

/** Who may record as-built data: the fabricator who measures the units, and the engineers; owners and viewers read. */
export const asBuiltRecorderRoles: readonly Role[] = ['admin', 'engineer', 'fabricator'];

export function canRecordAsBuilt(role: Role): boolean {
  return asBuiltRecorderRoles.includes(role);
}

/**
 * Physical ranges of one measured damper unit. Wide enough for any tuned mass damper unit of a footbridge or floor
 * (a few kg to a few tonnes, springs of a few kN/m to a few MN/m, frequencies of 0.5–10 Hz) and far beyond, but they
 * refuse what no weighing or shaker test gives (zero, negatives, 1e300).
 */
export const AS_BUILT_MIN_MASS_KG = 0.1;
export const AS_BUILT_MAX_MASS_KG = 1_000_000;
export const AS_BUILT_MIN_SPRING_RATE_N_PER_M = 1;
export const AS_BUILT_MAX_SPRING_RATE_N_PER_M = 1e10;
export const AS_BUILT_MIN_FREQUENCY_HZ = 0.01;
export const AS_BUILT_MAX_FREQUENCY_HZ = 100;
/** The most units a tuning variant may have (variantUnitCountSchema), so the most a record may list. */
export const AS_BUILT_MAX_UNITS = 100;
export const AS_BUILT_NOTE_MAX_CHARS = 2000;

const inRange = (min: number, max: number, unit: string) =>
  z
    .number({ error: typeError(`must be a number in ${unit}`) })
    .refine(Number.isFinite, { error: `must be a finite number in ${unit}` })
    .refine((value) => value >= min && value <= max, { error: `must be between ${min} and ${max} ${unit}` });

const text = (max: number) =>
  z
    .string({ error: typeError('must be text') })
    .trim()
    .max(max, `must be at most ${max} characters`)
    .refine((value) => !value.includes('\u0000'), 'must not contain NUL characters');

export const asBuiltUnitInputSchema = z.strictObject({
  unitNumber: z
    .number({ error: typeError('must be a whole number') })
    .int('must be a whole number')
    .min(1, 'must be at least 1 (units are numbered from 1)')
    .max(AS_BUILT_MAX_UNITS, `must be at most ${AS_BUILT_MAX_UNITS}`),
  movingMassKg: inRange(AS_BUILT_MIN_MASS_KG, AS_BUILT_MAX_MASS_KG, 'kg'),
  springRateNPerM: inRange(AS_BUILT_MIN_SPRING_RATE_N_PER_M, AS_BUILT_MAX_SPRING_RATE_N_PER_M, 'N/m').optional(),
  frequencyHz: inRange(AS_BUILT_MIN_FREQUENCY_HZ, AS_BUILT_MAX_FREQUENCY_HZ, 'Hz').optional(),
  /** The day of the measurement, ISO 8601 (YYYY-MM-DD). */
  measuredAt: z.iso.date({ error: 'must be a date (YYYY-MM-DD, e.g. 2026-11-30)' }).optional(),
  note: text(AS_BUILT_NOTE_MAX_CHARS).optional(),
});
export type AsBuiltUnitInput = z.infer<typeof asBuiltUnitInputSchema>;

/** Issues of unit numbers that repeat or lie beyond the sheet's unit count (null: the count is not known here). */
export function unitNumberIssues(units: readonly { unitNumber: number }[], unitCount: number | null): { path: (string | number)[]; message: string }[] {
  const issues: { path: (string | number)[]; message: string }[] = [];
  const seen = new Map<number, number>();
  units.forEach((unit, index) => {
    const path = ['units', index, 'unitNumber'];
    if (unitCount !== null && Number.isInteger(unit.unitNumber) && unit.unitNumber > unitCount) {
      issues.push({ path, message: `must be between 1 and ${unitCount}: the hardware sheet has ${unitCount} unit${unitCount === 1 ? '' : 's'}` });
    }
    const first = seen.get(unit.unitNumber);
    if (first !== undefined) issues.push({ path, message: `repeats unit ${unit.unitNumber} (already given at units.${first}); each unit once per record` });
    else seen.set(unit.unitNumber, index);
  });
  return issues;
}

/** The request body, with the unit numbers checked against the sheet's unit count when it is given. */
export function asBuiltInputSchemaFor(unitCount: number | null) {
  return z
    .strictObject({
      units: z
        .array(asBuiltUnitInputSchema, { error: typeError('must be a list of units') })
        .min(1, 'must list at least one unit')
        .max(AS_BUILT_MAX_UNITS, `must list at most ${AS_BUILT_MAX_UNITS} units`),
      note: text(AS_BUILT_NOTE_MAX_CHARS).optional(),
    })
    .superRefine((value, ctx) => {
      for (const issue of unitNumberIssues(value.units, unitCount)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
    });
}

/**
 * POST …/sign-offs/:signOffId/as-built. The route's validation knows no sheet yet, so it checks ranges and repeats;
 * the service checks the unit numbers against the sheet's unit count with the same rules (asBuiltInputSchemaFor).
 */
export const asBuiltInputSchema = asBuiltInputSchemaFor(null);
export type AsBuiltInput = z.infer<typeof asBuiltInputSchema>;

export const asBuiltParamsSchema = signOffParamsSchema;

// ---- answers ----

export const rangeVerdicts = ['inside', 'below', 'above'] as const;
export const rangeVerdictSchema = z.enum(rangeVerdicts);
export type RangeVerdict = z.infer<typeof rangeVerdictSchema>;

const deviationSchema = z.object({
  designValue: z.number(),
  measuredValue: z.number(),
  /** measured − design, in the quantity's unit. */
  absolute: z.number(),
  /** (measured − design) / design × 100. */
  percent: z.number(),
});

const rangeCheckSchema = z.object({ low: z.number(), high: z.number(), verdict: rangeVerdictSchema });

export const asBuiltUnitComparisonSchema = z.object({
  unitNumber: z.number().int(),
  movingMassKg: deviationSchema,
  springRateNPerM: deviationSchema.nullable(),
  frequencyHz: deviationSchema.nullable(),
  /** f = (1/2π) √(k/m) of the measured spring rate and moving mass; null unless both are given. */
  impliedFrequencyHz: deviationSchema.nullable(),
  massRange: rangeCheckSchema,
  springRateRange: rangeCheckSchema.nullable(),
  frequencyRange: rangeCheckSchema.nullable(),
  impliedFrequencyRange: rangeCheckSchema.nullable(),
  withinTuningRange: z.boolean(),
  warnings: z.array(z.string()),
});
export type AsBuiltUnitComparison = z.infer<typeof asBuiltUnitComparisonSchema>;

export const asBuiltComparisonSchema = z.object({
  unitCount: z.number().int(),
  recordedUnitCount: z.number().int(),
  design: z.object({
    movingMassPerUnitKg: z.number(),
    springRatePerUnitNPerM: z.number(),
    frequencyHz: z.number(),
    totalMovingMassKg: z.number(),
    modalMassKg: z.number(),
    massRatio: z.number(),
  }),
  units: z.array(asBuiltUnitComparisonSchema),
  /** Sum of the measured masses of the units recorded, against the design total of those units. */
  recordedMovingMassKg: deviationSchema,
  /** The mass ratio actually built (Σ measured masses / modal mass); null unless every unit is recorded. */
  builtMassRatio: z.number().nullable(),
  unitsOutsideRange: z.array(z.number().int()),
  warnings: z.array(z.string()),
});
export type AsBuiltComparison = z.infer<typeof asBuiltComparisonSchema>;

export const asBuiltUnitSchema = z.object({
  unitNumber: z.number().int(),
  movingMassKg: z.number(),
  springRateNPerM: z.number().optional(),
  frequencyHz: z.number().optional(),
  measuredAt: z.string().optional(),
  note: z.string().optional(),
});
export type AsBuiltUnit = z.infer<typeof asBuiltUnitSchema>;

export const asBuiltRecordSchema = z.object({
  id: z.string(),
  projectId: z.string(),
  signOffId: z.string(),
  units: z.array(asBuiltUnitSchema),
  note: z.string().nullable(),
  recordedBy: z.string().nullable(),
  recordedByName: z.string().nullable(),
  recordedAt: z.string(),
  comparison: asBuiltComparisonSchema,
});
export type AsBuiltRecord = z.infer<typeof asBuiltRecordSchema>;

/** GET …/as-built: every record of the sign-off, newest first. */
export const asBuiltRecordListSchema = z.object({ records: z.array(asBuiltRecordSchema) });
export type AsBuiltRecordList = z.infer<typeof asBuiltRecordListSchema>;
