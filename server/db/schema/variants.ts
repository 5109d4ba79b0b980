/**
 * Tuning variants of a project and the display preferences of a person. A variant points at one of the project's
 * modes, one or more load cases (in order, through `tuning_variant_load_cases`) and one set of comfort criteria; the
 * foreign keys refuse deleting any of them while a variant uses it. Its computed result is stored beside it as jsonb
 * with the hash of the inputs it was computed from and the engine version (docs/decisions/0012-tuning-variants.md).
 */
import { sql } from 'drizzle-orm';
import { check, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import type { ApiErrorBody } from '../../../shared/contracts/errors';
import type { VariantComputation, VariantHardware, VariantTuning } from '../../../shared/contracts/variants';
import { unitSystems } from '../../../shared/contracts/preferences';
import { users } from './auth';
import { projects } from './projects';
import { comfortCriteria, loadCases, structureModes } from './structural-model';

export const tuningVariants = pgTable(
  'tuning_variants',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    /** No action on delete: deleting a mode in use fails (the service answers 409 naming the variants first). */
    modeId: uuid()
      .notNull()
      .references(() => structureModes.id),
    criteriaId: uuid()
      .notNull()
      .references(() => comfortCriteria.id),
    massRatio: doublePrecision().notNull(),
    /** `{ method }` or `{ frequencyHz, dampingRatio }`. */
    tuning: jsonb().$type<VariantTuning>().notNull(),
    unitCount: integer().notNull().default(1),
    structureFrequencyToleranceRatio: doublePrecision().notNull().default(0.1),
    tmdDampingToleranceRatio: doublePrecision(),
    hardware: jsonb().$type<VariantHardware>().notNull().default({}),
    notes: text(),
    /** The last computation: its result or the engine's refusal, the hash of its inputs and the engine version. */
    result: jsonb().$type<VariantComputation>(),
    resultError: jsonb().$type<ApiErrorBody['error']>(),
    inputsHash: text(),
    engineVersion: text(),
    computedAt: timestamp({ withTimezone: true }),
    version: integer().notNull().default(1),
    createdBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('tuning_variants_project_idx').on(table.projectId),
    index('tuning_variants_mode_idx').on(table.modeId),
    index('tuning_variants_criteria_idx').on(table.criteriaId),
    check('tuning_variants_name_not_blank', sql`length(trim(${table.name})) > 0`),
    check('tuning_variants_version_positive', sql`${table.version} >= 1`),
    check('tuning_variants_mass_ratio_range', sql`${table.massRatio} > 0 and ${table.massRatio} <= 0.25`),
    check('tuning_variants_unit_count_range', sql`${table.unitCount} between 1 and 100`),
    check('tuning_variants_tolerance_range', sql`${table.structureFrequencyToleranceRatio} >= 0 and ${table.structureFrequencyToleranceRatio} <= 0.5`),
    check('tuning_variants_damping_tolerance_range', sql`${table.tmdDampingToleranceRatio} is null or (${table.tmdDampingToleranceRatio} >= 0 and ${table.tmdDampingToleranceRatio} <= 0.9)`),
    check('tuning_variants_tuning_is_object', sql`jsonb_typeof(${table.tuning}) = 'object'`),
  ],
);

/** The load cases of a variant, in the variant's order; deleting a load case in use fails. */
export const tuningVariantLoadCases = pgTable(
  'tuning_variant_load_cases',
  {
    variantId: uuid()
      .notNull()
      .references(() => tuningVariants.id, { onDelete: 'cascade' }),
    position: integer().notNull(),
    loadCaseId: uuid()
      .notNull()
      .references(() => loadCases.id),
  },
  (table) => [
    primaryKey({ name: 'tuning_variant_load_cases_pk', columns: [table.variantId, table.position] }),
    unique('tuning_variant_load_cases_once').on(table.variantId, table.loadCaseId),
    index('tuning_variant_load_cases_load_case_idx').on(table.loadCaseId),
    check('tuning_variant_load_cases_position', sql`${table.position} >= 0`),
  ],
);

export const unitSystemEnum = pgEnum('unit_system', unitSystems);

/** Display preferences of a person (the API and stored values stay SI whatever they choose). */
export const userPreferences = pgTable('user_preferences', {
  userId: uuid()
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  unitSystem: unitSystemEnum().notNull().default('si'),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
