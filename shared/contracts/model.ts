import { z } from 'zod';
import { maxProjectVersion } from './projects';
import { criteriaSchema, designStructureSchema, directionSchema, loadCaseSchema } from './compute-design';
import { MAX_DOF, modeSchema as engineModeSchema, modesRequestSchema } from './compute';
import { typeError } from './messages';
import { MAX_BEAM_MODE_NUMBER, beamSupports } from '../engine/beam';

/**
 * The structural model of a project, as stored and served: structures, their modes and lumped (n-DOF) models, and
 * the project's load cases and comfort criteria. A saved mode is the engine's structure mode (`designStructureSchema`)
 * plus a label and its source; a saved load case is the engine's `loadCase` plus a name; saved comfort criteria are
 * the engine's `criteria` plus a name and a sign-off status. SI units, named in every field.
 */

/** Text a person types: trimmed, bounded, and without NUL characters (which no text column can store). */
const trimmed = (max: number) =>
  z
    .string({ error: typeError('must be text') })
    .trim()
    .max(max, `must be at most ${max} characters`)
    .refine((value) => !value.includes('\u0000'), 'must not contain a NUL character (\\u0000)');
const name = (max = 120) => trimmed(max).min(1, 'is required');
const num = () => z.number({ error: typeError('must be a number') }).finite('must be a finite number');
const positive = () => num().positive('must be greater than 0');
const wholeNumber = () => z.number({ error: typeError('must be a whole number') }).int('must be a whole number');
const version = z
  .number({ error: typeError('must be the version number you read') })
  .int('must be a whole number')
  .min(1, 'must be at least 1')
  .max(maxProjectVersion, `must be at most ${maxProjectVersion}`);
const uuid = (what: string) => z.uuid(`must be ${what} id (UUID)`);

/** Fields every stored thing carries. */
const recordFields = {
  id: z.string(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** Id of the person who created it; null once that person's account is gone. */
  createdBy: z.string().nullable(),
};

// ---------- path parameters ----------
export const projectParamsSchema = z.object({ projectId: uuid('a project') });
export const structureParamsSchema = projectParamsSchema.extend({ structureId: uuid('a structure') });
export const modeParamsSchema = structureParamsSchema.extend({ modeId: uuid('a mode') });
export const lumpedModelParamsSchema = structureParamsSchema.extend({ modelId: uuid('a model') });
export const loadCaseParamsSchema = projectParamsSchema.extend({ loadCaseId: uuid('a load case') });
export const comfortCriteriaParamsSchema = projectParamsSchema.extend({ criteriaId: uuid('a comfort criteria') });

// ---------- structures ----------
export const structureKinds = ['footbridge-span', 'floor-bay'] as const;
export const structureKindSchema = z.enum(structureKinds, { error: typeError('must be "footbridge-span" or "floor-bay"') });
export type StructureKind = z.infer<typeof structureKindSchema>;

export const createStructureSchema = z.strictObject({
  name: name(),
  kind: structureKindSchema,
  spanM: positive().optional(),
  widthM: positive().optional(),
  deckAreaM2: positive().optional(),
  notes: trimmed(4000).optional(),
});
export type CreateStructureInput = z.infer<typeof createStructureSchema>;

/** PATCH: the version read plus the fields to change; null clears an optional field. */
export const updateStructureSchema = z.strictObject({
  version,
  name: name().optional(),
  kind: structureKindSchema.optional(),
  spanM: positive().nullable().optional(),
  widthM: positive().nullable().optional(),
  deckAreaM2: positive().nullable().optional(),
  notes: trimmed(4000).nullable().optional(),
});
export type UpdateStructureInput = z.infer<typeof updateStructureSchema>;

export const structureSchema = z.object({
  ...recordFields,
  projectId: z.string(),
  name: z.string(),
  kind: structureKindSchema,
  spanM: z.number().nullable(),
  widthM: z.number().nullable(),
  deckAreaM2: z.number().nullable(),
  notes: z.string().nullable(),
});
export type Structure = z.infer<typeof structureSchema>;
export const structureListSchema = z.object({ structures: z.array(structureSchema) });
export type StructureList = z.infer<typeof structureListSchema>;

// ---------- modes ----------
export const beamSupportSchema = z.enum(beamSupports, { error: typeError('must be "simply-supported", "fixed-fixed" or "cantilever"') });

/** Numbers typed from an FE model (the default). */
export const typedModeSourceSchema = z.strictObject({ kind: z.literal('typed') });
/** A uniform beam: the server derives frequencyHz, modalMassKg and modeShapeMean (shared/engine/beam.ts). */
export const beamModeSourceSchema = z.strictObject({
  kind: z.literal('beam'),
  support: beamSupportSchema,
  lengthM: positive(),
  bendingStiffnessNM2: positive(),
  massPerLengthKgPerM: positive(),
  modeNumber: wholeNumber().min(1, 'must be at least 1').max(MAX_BEAM_MODE_NUMBER, `must be at most ${MAX_BEAM_MODE_NUMBER}`).default(1),
});
/**
 * A mode of a saved lumped model of the same structure: its frequency, and modal mass 1/φ² at `dofIndex` for the
 * mass-normalised shape (the shape scaled to 1 at the damper's DOF).
 */
export const lumpedModelModeSourceSchema = z.strictObject({
  kind: z.literal('lumped-model'),
  /** Stored in lower case, the way PostgreSQL writes a uuid. */
  modelId: uuid('a model').transform((id) => id.toLowerCase()),
  /** 1-based, modes in ascending frequency. */
  modeNumber: wholeNumber().min(1, 'must be at least 1').max(MAX_DOF, `must be at most ${MAX_DOF}`),
  /** 0-based DOF where the damper sits. */
  dofIndex: wholeNumber().min(0, 'must be 0 or greater').max(MAX_DOF - 1, `must be at most ${MAX_DOF - 1}`),
});
export const modeSourceSchema = z.discriminatedUnion('kind', [typedModeSourceSchema, beamModeSourceSchema, lumpedModelModeSourceSchema], {
  error: typeError('must have a "kind" of typed, beam or lumped-model'),
});
export type ModeSource = z.infer<typeof modeSourceSchema>;
export type ModeSourceInput = z.input<typeof modeSourceSchema>;
export type ModeSourceKind = ModeSource['kind'];

/** Mean |φ| over the deck for the unit-max shape (crowd load cases), the engine's rule. */
const modeShapeMean = () => positive().max(1, 'must be at most 1 (mean of |φ| for the unit-max mode shape)');

const engineModeFields = designStructureSchema.shape;

/** The fields a derived source gives: sent with such a source they are refused, naming the field. */
export const derivedModeFields: Record<ModeSourceKind, readonly ('frequencyHz' | 'modalMassKg' | 'modeShapeMean')[]> = {
  typed: [],
  beam: ['frequencyHz', 'modalMassKg', 'modeShapeMean'],
  'lumped-model': ['frequencyHz', 'modalMassKg'],
};

function checkValuesAgainstSource(
  value: { source?: ModeSource; frequencyHz?: number; modalMassKg?: number; modeShapeMean?: number | null },
  ctx: z.RefinementCtx,
  requireTyped: boolean,
): void {
  const kind = value.source?.kind;
  if (kind === undefined) return;
  for (const field of derivedModeFields[kind]) {
    if (value[field] !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: [field],
        message: `must not be sent with a ${kind} source: the server derives it from the source (leave it out)`,
      });
    }
  }
  if (kind === 'typed' && requireTyped) {
    for (const field of ['frequencyHz', 'modalMassKg'] as const) {
      if (value[field] === undefined) ctx.addIssue({ code: 'custom', path: [field], message: 'is required for a typed mode' });
    }
  }
}

/** POST …/modes. `frequencyHz` and `modalMassKg` are given for a typed mode only. */
export const createModeSchema = z
  .strictObject({
    label: name(),
    direction: directionSchema.default('vertical'),
    frequencyHz: engineModeFields.frequencyHz.optional(),
    modalMassKg: engineModeFields.modalMassKg.optional(),
    dampingRatio: engineModeFields.dampingRatio,
    modeShapeMean: modeShapeMean().optional(),
    source: modeSourceSchema.default({ kind: 'typed' }),
  })
  .superRefine((value, ctx) => checkValuesAgainstSource(value, ctx, true));
export type CreateModeInput = z.input<typeof createModeSchema>;
export type CreateModeParsed = z.output<typeof createModeSchema>;

/**
 * PATCH …/modes/:modeId. A new source replaces the old one (a derived source re-derives the numbers; `typed` keeps
 * the last numbers unless new ones are given); the numbers of a mode that stays derived cannot be typed over.
 */
export const updateModeSchema = z
  .strictObject({
    version,
    label: name().optional(),
    direction: directionSchema.optional(),
    frequencyHz: engineModeFields.frequencyHz.optional(),
    modalMassKg: engineModeFields.modalMassKg.optional(),
    dampingRatio: engineModeFields.dampingRatio.optional(),
    modeShapeMean: modeShapeMean().nullable().optional(),
    source: modeSourceSchema.optional(),
  })
  .superRefine((value, ctx) => checkValuesAgainstSource(value, ctx, false));
export type UpdateModeInput = z.input<typeof updateModeSchema>;
export type UpdateModeParsed = z.output<typeof updateModeSchema>;

/** A stored mode: the engine's structure mode (modalMassKg, frequencyHz, dampingRatio, direction) + label + source. */
export const savedModeSchema = z.object({
  ...recordFields,
  projectId: z.string(),
  structureId: z.string(),
  label: z.string(),
  direction: directionSchema,
  frequencyHz: z.number(),
  modalMassKg: z.number(),
  dampingRatio: z.number(),
  modeShapeMean: z.number().nullable(),
  source: modeSourceSchema,
});
export type SavedMode = z.infer<typeof savedModeSchema>;
export const modeListSchema = z.object({ modes: z.array(savedModeSchema) });
export type ModeList = z.infer<typeof modeListSchema>;

// ---------- lumped models ----------
const matrixFields = modesRequestSchema.shape;
const dofLabels = z.array(trimmed(80).min(1, 'is required'), { error: typeError('must be an array of DOF labels') });

function checkDofLabels(labels: readonly string[] | null | undefined, matrix: readonly unknown[] | undefined, ctx: z.RefinementCtx): void {
  if (labels && matrix && labels.length !== matrix.length) {
    ctx.addIssue({ code: 'custom', path: ['dofLabels'], message: `must have ${matrix.length} labels, one per DOF (got ${labels.length})` });
  }
}

/** The engine's `modes` rules (square, symmetric, positive diagonal mass, same size) on a pair of matrices. */
export function lumpedMatrixIssues(value: { massMatrixKg: number[][]; stiffnessMatrixNPerM: number[][] }): z.core.$ZodIssue[] {
  const result = modesRequestSchema.safeParse({ massMatrixKg: value.massMatrixKg, stiffnessMatrixNPerM: value.stiffnessMatrixNPerM });
  return result.success ? [] : result.error.issues;
}

/** The cross-entry rules only (shape, symmetry, diagonal): entry-level issues come from the field schemas themselves. */
function matrixRuleIssues(value: { massMatrixKg: number[][]; stiffnessMatrixNPerM: number[][] }) {
  return lumpedMatrixIssues(value).filter((issue) => issue.code === 'custom');
}

/** POST …/models. M must also be positive definite: the server refuses one whose Cholesky factorisation fails. */
export const createLumpedModelSchema = z
  .strictObject({
    name: name(),
    massMatrixKg: matrixFields.massMatrixKg,
    stiffnessMatrixNPerM: matrixFields.stiffnessMatrixNPerM,
    dofLabels: dofLabels.optional(),
  })
  .superRefine((value, ctx) => {
    for (const issue of matrixRuleIssues(value)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
    checkDofLabels(value.dofLabels, value.massMatrixKg, ctx);
  });
export type CreateLumpedModelInput = z.infer<typeof createLumpedModelSchema>;

/** PATCH …/models/:modelId. The server checks the matrices after the change together, and re-derives the modes taken from it. */
export const updateLumpedModelSchema = z
  .strictObject({
    version,
    name: name().optional(),
    massMatrixKg: matrixFields.massMatrixKg.optional(),
    stiffnessMatrixNPerM: matrixFields.stiffnessMatrixNPerM.optional(),
    dofLabels: dofLabels.nullable().optional(),
  })
  .superRefine((value, ctx) => {
    if (value.massMatrixKg && value.stiffnessMatrixNPerM) {
      for (const issue of matrixRuleIssues({ massMatrixKg: value.massMatrixKg, stiffnessMatrixNPerM: value.stiffnessMatrixNPerM })) {
        ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
      }
    }
    checkDofLabels(value.dofLabels, value.massMatrixKg ?? value.stiffnessMatrixNPerM, ctx);
  });
export type UpdateLumpedModelInput = z.infer<typeof updateLumpedModelSchema>;

export const lumpedModelSchema = z.object({
  ...recordFields,
  projectId: z.string(),
  structureId: z.string(),
  name: z.string(),
  massMatrixKg: z.array(z.array(z.number())),
  stiffnessMatrixNPerM: z.array(z.array(z.number())),
  dofLabels: z.array(z.string()).nullable(),
  /** Undamped modes (the engine's `modes` answer): ascending frequencies, mass-normalised shapes. */
  modes: z.array(engineModeSchema),
});
export type LumpedModel = z.infer<typeof lumpedModelSchema>;
export const lumpedModelListSchema = z.object({ models: z.array(lumpedModelSchema) });
export type LumpedModelList = z.infer<typeof lumpedModelListSchema>;

// ---------- load cases ----------
/**
 * A crowd or lateral crowd names exactly one of densityPerM2 and trafficClass, and a class of its guide (the same
 * rule as the engine's design commands, which check it against the structure).
 */
function checkCrowdSpec(spec: z.infer<typeof loadCaseSchema>, ctx: z.RefinementCtx): void {
  if (spec.kind !== 'crowd' && spec.kind !== 'lateral') return;
  const hasDensity = spec.densityPerM2 !== undefined;
  const hasClass = spec.trafficClass !== undefined;
  if (hasDensity === hasClass) {
    ctx.addIssue({ code: 'custom', path: ['spec', 'densityPerM2'], message: 'give exactly one of densityPerM2 and trafficClass' });
  }
  if (hasClass) {
    const classes = spec.guide === 'setra' ? ['I', 'II', 'III'] : ['TC1', 'TC2', 'TC3', 'TC4', 'TC5'];
    if (!classes.includes(spec.trafficClass as string)) {
      ctx.addIssue({ code: 'custom', path: ['spec', 'trafficClass'], message: `must be one of ${classes.join(', ')} for guide ${spec.guide}` });
    }
  }
}

export const createLoadCaseSchema = z
  .strictObject({ name: name(), spec: loadCaseSchema })
  .superRefine((value, ctx) => checkCrowdSpec(value.spec, ctx));
export type CreateLoadCaseInput = z.input<typeof createLoadCaseSchema>;

/** PATCH: a new `spec` replaces the whole spec. */
export const updateLoadCaseSchema = z
  .strictObject({ version, name: name().optional(), spec: loadCaseSchema.optional() })
  .superRefine((value, ctx) => {
    if (value.spec) checkCrowdSpec(value.spec, ctx);
  });
export type UpdateLoadCaseInput = z.input<typeof updateLoadCaseSchema>;

export const savedLoadCaseSchema = z.object({
  ...recordFields,
  projectId: z.string(),
  name: z.string(),
  spec: loadCaseSchema,
});
export type SavedLoadCase = z.infer<typeof savedLoadCaseSchema>;
export const loadCaseListSchema = z.object({ loadCases: z.array(savedLoadCaseSchema) });
export type LoadCaseList = z.infer<typeof loadCaseListSchema>;

// ---------- comfort criteria ----------
/** Sign-off status; new criteria are drafts, and only sign-off moves them (clients cannot set it). */
export const comfortCriteriaStatuses = ['draft', 'submitted', 'approved', 'returned'] as const;
export const comfortCriteriaStatusSchema = z.enum(comfortCriteriaStatuses);
export type ComfortCriteriaStatus = z.infer<typeof comfortCriteriaStatusSchema>;

export const createComfortCriteriaSchema = z.strictObject({ name: name(), spec: criteriaSchema });
export type CreateComfortCriteriaInput = z.input<typeof createComfortCriteriaSchema>;

export const updateComfortCriteriaSchema = z.strictObject({ version, name: name().optional(), spec: criteriaSchema.optional() });
export type UpdateComfortCriteriaInput = z.input<typeof updateComfortCriteriaSchema>;

export const comfortCriteriaSchema = z.object({
  ...recordFields,
  projectId: z.string(),
  name: z.string(),
  spec: criteriaSchema,
  status: comfortCriteriaStatusSchema,
});
export type ComfortCriteria = z.infer<typeof comfortCriteriaSchema>;
export const comfortCriteriaListSchema = z.object({ comfortCriteria: z.array(comfortCriteriaSchema) });
export type ComfortCriteriaList = z.infer<typeof comfortCriteriaListSchema>;
