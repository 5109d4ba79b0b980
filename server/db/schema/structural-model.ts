/**
 * The structural model of a project: structures, their modes and lumped (n-DOF) models, and the project's load
 * cases and comfort criteria. Engine inputs (a mode's source, a load case, comfort criteria, matrices) are kept as
 * jsonb, validated on the way in by the same zod schema the engine's commands use (docs/decisions/0010).
 * Every table carries `version` (optimistic concurrency, as projects do), createdBy, createdAt and updatedAt.
 */
import { sql } from 'drizzle-orm';
import { check, doublePrecision, foreignKey, index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import type { ComfortCriteria, ModeSource, SavedLoadCase, StructureKind } from '../../../shared/contracts/model';
import { comfortCriteriaStatuses, structureKinds } from '../../../shared/contracts/model';
import { modeDirections } from '../../../shared/engine/types';
import { users } from './auth';
import { projects } from './projects';

export const structureKindEnum = pgEnum('structure_kind', structureKinds satisfies readonly StructureKind[]);
/** Every direction a mode may have; the API accepts the ones the engine's direction list names. */
export const modeDirectionEnum = pgEnum('mode_direction', modeDirections);
export const comfortCriteriaStatusEnum = pgEnum('comfort_criteria_status', comfortCriteriaStatuses);

const bookkeeping = () => ({
  /** Optimistic concurrency: every change must name the version it read; it then goes up by one. */
  version: integer().notNull().default(1),
  createdBy: uuid().references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

export const structures = pgTable(
  'structures',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    kind: structureKindEnum().notNull(),
    spanM: doublePrecision(),
    widthM: doublePrecision(),
    deckAreaM2: doublePrecision('deck_area_m2'),
    notes: text(),
    ...bookkeeping(),
  },
  (table) => [
    index('structures_project_idx').on(table.projectId),
    check('structures_name_not_blank', sql`length(trim(${table.name})) > 0`),
    check('structures_version_positive', sql`${table.version} >= 1`),
    check('structures_dimensions_positive', sql`coalesce(${table.spanM}, 1) > 0 and coalesce(${table.widthM}, 1) > 0 and coalesce(${table.deckAreaM2}, 1) > 0`),
  ],
);

export const lumpedModels = pgTable(
  'lumped_models',
  {
    id: uuid().primaryKey().defaultRandom(),
    structureId: uuid()
      .notNull()
      .references(() => structures.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    massMatrixKg: jsonb().$type<number[][]>().notNull(),
    stiffnessMatrixNPerM: jsonb().$type<number[][]>().notNull(),
    dofLabels: jsonb().$type<string[]>(),
    ...bookkeeping(),
  },
  (table) => [
    index('lumped_models_structure_idx').on(table.structureId),
    // Target of the modes' (structure, model) key: a mode takes its numbers from a model of its own structure.
    unique('lumped_models_structure_id_unique').on(table.structureId, table.id),
    check('lumped_models_name_not_blank', sql`length(trim(${table.name})) > 0`),
    check('lumped_models_version_positive', sql`${table.version} >= 1`),
    check('lumped_models_matrices_are_arrays', sql`jsonb_typeof(${table.massMatrixKg}) = 'array' and jsonb_typeof(${table.stiffnessMatrixNPerM}) = 'array'`),
  ],
);

export const structureModes = pgTable(
  'structure_modes',
  {
    id: uuid().primaryKey().defaultRandom(),
    structureId: uuid()
      .notNull()
      .references(() => structures.id, { onDelete: 'cascade' }),
    label: text().notNull(),
    direction: modeDirectionEnum().notNull(),
    frequencyHz: doublePrecision().notNull(),
    /** For the mode shape scaled to 1 where the damper sits. */
    modalMassKg: doublePrecision().notNull(),
    dampingRatio: doublePrecision().notNull(),
    /** Mean |φ| over the deck for the unit-max shape (crowd load cases). */
    modeShapeMean: doublePrecision(),
    /** Where the numbers come from: typed, a beam, or a lumped model (then also `lumpedModelId`). */
    source: jsonb().$type<ModeSource>().notNull().default({ kind: 'typed' }),
    /** The model a lumped-model source names (kept equal to source.modelId): deleting a model in use fails. */
    lumpedModelId: uuid(),
    ...bookkeeping(),
  },
  (table) => [
    index('structure_modes_structure_idx').on(table.structureId),
    index('structure_modes_lumped_model_idx').on(table.lumpedModelId),
    foreignKey({
      name: 'structure_modes_lumped_model_fk',
      columns: [table.structureId, table.lumpedModelId],
      foreignColumns: [lumpedModels.structureId, lumpedModels.id],
    }),
    check('structure_modes_label_not_blank', sql`length(trim(${table.label})) > 0`),
    check('structure_modes_version_positive', sql`${table.version} >= 1`),
    check('structure_modes_frequency_positive', sql`${table.frequencyHz} > 0`),
    check('structure_modes_modal_mass_positive', sql`${table.modalMassKg} > 0`),
    check('structure_modes_damping_ratio_range', sql`${table.dampingRatio} >= 0 and ${table.dampingRatio} < 1`),
    check('structure_modes_mode_shape_mean_range', sql`${table.modeShapeMean} is null or (${table.modeShapeMean} > 0 and ${table.modeShapeMean} <= 1)`),
    check('structure_modes_source_kind', sql`${table.source}->>'kind' in ('typed', 'beam', 'lumped-model')`),
    check(
      'structure_modes_lumped_model_matches_source',
      sql`(${table.source}->>'kind' = 'lumped-model') = (${table.lumpedModelId} is not null) and (${table.lumpedModelId} is null or ${table.lumpedModelId}::text = ${table.source}->>'modelId')`,
    ),
  ],
);

export const loadCases = pgTable(
  'load_cases',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    /** The engine's `loadCase` (every kind). */
    spec: jsonb().$type<SavedLoadCase['spec']>().notNull(),
    ...bookkeeping(),
  },
  (table) => [
    index('load_cases_project_idx').on(table.projectId),
    check('load_cases_name_not_blank', sql`length(trim(${table.name})) > 0`),
    check('load_cases_version_positive', sql`${table.version} >= 1`),
    check('load_cases_spec_kind', sql`jsonb_typeof(${table.spec}->'kind') = 'string'`),
  ],
);

export const comfortCriteria = pgTable(
  'comfort_criteria',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    /** The engine's `criteria` (a guide's class, a code limit or custom numbers). */
    spec: jsonb().$type<ComfortCriteria['spec']>().notNull(),
    /** Moved only by sign-off. */
    status: comfortCriteriaStatusEnum().notNull().default('draft'),
    ...bookkeeping(),
  },
  (table) => [
    index('comfort_criteria_project_idx').on(table.projectId),
    check('comfort_criteria_name_not_blank', sql`length(trim(${table.name})) > 0`),
    check('comfort_criteria_version_positive', sql`${table.version} >= 1`),
    check('comfort_criteria_spec_set', sql`jsonb_typeof(${table.spec}->'set') = 'string'`),
  ],
);
