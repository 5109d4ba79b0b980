import { createHash } from 'node:crypto';
import type { Database } from '../../db/client';
import type { Executor } from '../../db/executor';
import { HttpError, invalidField, notFound } from '../../lib/http-error';
import { givenFields, nothingToChange, versionConflict } from '../../lib/versioned';
import { FOREIGN_KEY_VIOLATION, pgErrorCode } from '../../lib/pg-errors';
import type { CurrentUser } from '../../middleware/auth';
import { ComputeInputError } from '../../../shared/compute/types';
import { variantEngineVersion, type VariantComputeInput } from '../../../shared/compute/variant';
import {
  isManualTuning,
  type CreateVariantParsed,
  type UpdateVariantParsed,
  type Variant,
  type VariantComputation,
  type VariantCurves,
  type VariantSize,
} from '../../../shared/contracts/variants';
import type { ApiErrorBody } from '../../../shared/contracts/errors';
import { requireProjectScope } from '../structures/structures.service';
import type { ProjectScope } from '../structures/structures.repository';
import * as repository from './variants.repository';
import { computeVariant } from './variant-compute';
import type { EnginePool } from '../../workers/engine-pool';
import { frozenWrite, isFrozen, refuseIfFrozen } from '../sign-offs/freeze';
import { asActor } from '../../db/actor';

const variantNotFound = () => notFound('The tuning variant', 'variant_not_found');

/** A mode, load case or criteria deleted between reading it and storing the variant: the keys refuse the write. */
async function storing<T>(write: () => Promise<T>): Promise<T> {
  try {
    return await write();
  } catch (error) {
    if (pgErrorCode(error) === FOREIGN_KEY_VIOLATION) {
      throw new HttpError(409, 'reference_deleted', 'A mode, load case or comfort criteria the variant names was deleted meanwhile; nothing was stored', [
        { path: '', message: 'a mode, load case or comfort criteria the variant names was deleted meanwhile' },
      ]);
    }
    throw error;
  }
}

/** The engine's refusal of a variant's inputs as a 400 naming the variant's fields. */
function computeRefusal(error: ComputeInputError): HttpError {
  return new HttpError(400, 'invalid_request', error.message, error.issues);
}

/** JSON with the keys of every object sorted, so that equal inputs always give the same text (and hash). */
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** sha256 of the engine version and every input of the computation (the mode's numbers, load cases, criteria, settings). */
export function variantInputsHash(input: VariantComputeInput): string {
  return createHash('sha256').update(canonicalJson({ engineVersion: variantEngineVersion, input })).digest('hex');
}

type VariantFields = Pick<
  repository.VariantRow,
  'modeId' | 'criteriaId' | 'massRatio' | 'tuning' | 'unitCount' | 'structureFrequencyToleranceRatio' | 'tmdDampingToleranceRatio' | 'hardware'
> & { loadCaseIds: readonly string[] };

/**
 * The computation's inputs, read from the variant's project: a mode, load case or criteria of another project (or
 * organisation, or none) is 400 naming the field.
 */
async function computeInputOf(db: Executor, scope: ProjectScope, fields: VariantFields): Promise<VariantComputeInput> {
  const mode = await repository.findProjectMode(db, scope, fields.modeId);
  if (!mode) throw invalidField('modeId', 'is not a mode of a structure of this project');
  const rows = await repository.findProjectLoadCases(db, scope, fields.loadCaseIds);
  const loadCases = fields.loadCaseIds.map((id, i) => {
    const row = rows.find((r) => r.id === id);
    if (!row) throw invalidField(`loadCaseIds.${i}`, 'is not a load case of this project');
    return { id: row.id, name: row.name, spec: row.spec };
  });
  const criteria = await repository.findProjectCriteria(db, scope, fields.criteriaId);
  if (!criteria) throw invalidField('criteriaId', 'is not a comfort criteria of this project');
  return {
    mode: { modalMassKg: mode.modalMassKg, frequencyHz: mode.frequencyHz, dampingRatio: mode.dampingRatio, direction: mode.direction, modeShapeMean: mode.modeShapeMean },
    loadCases,
    criteria: { spec: criteria.spec },
    variant: {
      massRatio: fields.massRatio,
      tuning: fields.tuning,
      unitCount: fields.unitCount,
      structureFrequencyToleranceRatio: fields.structureFrequencyToleranceRatio,
      tmdDampingToleranceRatio: fields.tmdDampingToleranceRatio,
      hardware: fields.hardware,
    },
  };
}

/** Runs the computation: its result, or (`refuse` false) the engine's refusal kept as the variant's resultError. */
async function computation(engine: EnginePool, input: VariantComputeInput, refuse: boolean): Promise<repository.ComputationValues> {
  const base = { inputsHash: variantInputsHash(input), engineVersion: variantEngineVersion, computedAt: new Date() };
  try {
    return { ...base, result: await computeVariant(engine, { kind: 'result', input }), resultError: null };
  } catch (error) {
    if (!(error instanceof ComputeInputError)) throw error;
    if (refuse) throw computeRefusal(error);
    const resultError: ApiErrorBody['error'] = { code: 'invalid_inputs', message: error.message, issues: error.issues };
    return { ...base, result: null, resultError };
  }
}

/** `stale`: an approved result served as it is although the running engine version is another (see `fresh`). */
function toVariant(record: repository.VariantRecord, stale = false): Variant {
  const { row, loadCaseIds } = record;
  const result = row.result as VariantComputation | null;
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    modeId: row.modeId,
    loadCaseIds,
    criteriaId: row.criteriaId,
    massRatio: row.massRatio,
    tuning: row.tuning,
    unitCount: row.unitCount,
    structureFrequencyToleranceRatio: row.structureFrequencyToleranceRatio,
    tmdDampingToleranceRatio: row.tmdDampingToleranceRatio,
    hardware: row.hardware,
    notes: row.notes,
    result:
      result && row.inputsHash && row.engineVersion && row.computedAt
        ? { ...result, stale, inputsHash: row.inputsHash, engineVersion: row.engineVersion, computedAt: row.computedAt.toISOString() }
        : null,
    resultError: row.resultError ?? null,
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/**
 * Lazy on read: the stored result is served only when the hash of the variant's current inputs (its mode, load
 * cases and criteria as they are now, its own settings, the engine version) equals the stored one; otherwise it is
 * recomputed and stored first. No stale number is ever served.
 */
async function fresh(db: Database, engine: EnginePool, scope: ProjectScope, record: repository.VariantRecord): Promise<Variant> {
  const input = await computeInputOf(db, scope, { ...record.row, loadCaseIds: record.loadCaseIds }).catch((error: unknown) => {
    // A thing the variant points at can no longer be read in its project (cannot happen while the keys hold).
    if (error instanceof HttpError) return null;
    throw error;
  });
  if (!input) throw new HttpError(409, 'variant_inputs_missing', 'A mode, load case or criteria of this tuning variant is missing');
  if (record.row.inputsHash === variantInputsHash(input) && record.row.engineVersion === variantEngineVersion) return toVariant(record);
  // An approved variant's result never moves (its inputs are frozen; only a new engine version can differ): the
  // stored result, the one its sign-off's snapshot holds, is served as it is (docs/decisions/0019-sign-off-freeze.md).
  // It says so with `stale` when the engine that computed it is not the running one.
  if (await isFrozen(db, { variantId: record.row.id })) return toVariant(record, record.row.engineVersion !== variantEngineVersion);
  const values = await computation(engine, input, false);
  await repository.storeComputation(db, record.row.id, record.row.version, values);
  return toVariant({ ...record, row: { ...record.row, ...values } });
}

export async function listVariants(db: Database, engine: EnginePool, user: CurrentUser, projectId: string): Promise<Variant[]> {
  const scope = await requireProjectScope(db, user, projectId);
  const records = await repository.listVariants(db, scope);
  const out: Variant[] = [];
  for (const record of records) out.push(await fresh(db, engine, scope, record));
  return out;
}

async function requireVariant(db: Database, scope: ProjectScope, id: string): Promise<repository.VariantRecord> {
  const record = await repository.findVariant(db, scope, id);
  if (!record) throw variantNotFound();
  return record;
}

export async function getVariant(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, id: string): Promise<Variant> {
  const scope = await requireProjectScope(db, user, projectId);
  return fresh(db, engine, scope, await requireVariant(db, scope, id));
}

export async function createVariant(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, input: CreateVariantParsed): Promise<Variant> {
  const scope = await requireProjectScope(db, user, projectId);
  const values: repository.VariantValues = {
    name: input.name,
    modeId: input.modeId,
    criteriaId: input.criteriaId,
    massRatio: input.massRatio,
    tuning: input.tuning,
    unitCount: input.unitCount,
    structureFrequencyToleranceRatio: input.structureFrequencyToleranceRatio,
    tmdDampingToleranceRatio: input.tmdDampingToleranceRatio ?? null,
    hardware: input.hardware,
    notes: input.notes ?? null,
  };
  const computeInput = await computeInputOf(db, scope, { ...values, loadCaseIds: input.loadCaseIds });
  const computed = await computation(engine, computeInput, true);
  return toVariant(await storing(() => asActor(db, user, (tx) => repository.insertVariant(tx, scope, user.id, { ...values, ...computed }, input.loadCaseIds))));
}

const changeableFields = [
  'name', 'modeId', 'loadCaseIds', 'criteriaId', 'massRatio', 'tuning', 'unitCount', 'structureFrequencyToleranceRatio', 'tmdDampingToleranceRatio', 'hardware', 'notes',
];

async function applyChanges(db: Database, engine: EnginePool, user: CurrentUser, scope: ProjectScope, id: string, input: UpdateVariantParsed): Promise<Variant> {
  const { version, loadCaseIds, ...fields } = input;
  const changes = givenFields(fields) as Partial<repository.VariantValues>;
  if (Object.keys(changes).length === 0 && loadCaseIds === undefined) throw nothingToChange(changeableFields);
  const current = await requireVariant(db, scope, id);
  await refuseIfFrozen(db, 'The tuning variant', { variantId: id });
  if (current.row.version !== version) throw versionConflict('The tuning variant', version, current.row.version);
  const merged = { ...current.row, ...changes, loadCaseIds: loadCaseIds ?? current.loadCaseIds };
  const computed = await computation(engine, await computeInputOf(db, scope, merged), true);
  const updated = await frozenWrite('The tuning variant', () =>
    storing(() => asActor(db, user, (tx) => repository.updateVariantAtVersion(tx, scope, id, version, { ...changes, ...computed }, loadCaseIds))),
  );
  if (updated) return toVariant(updated);
  const now = await repository.findVariant(db, scope, id);
  if (!now) throw variantNotFound();
  throw versionConflict('The tuning variant', version, now.row.version);
}

export async function updateVariant(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, id: string, input: UpdateVariantParsed): Promise<Variant> {
  const scope = await requireProjectScope(db, user, projectId);
  return applyChanges(db, engine, user, scope, id, input);
}

export async function deleteVariant(db: Database, user: CurrentUser, projectId: string, id: string): Promise<void> {
  const scope = await requireProjectScope(db, user, projectId);
  await refuseIfFrozen(db, 'The tuning variant', { variantId: id });
  if (!(await frozenWrite('The tuning variant', () => asActor(db, user, (tx) => repository.deleteVariant(tx, scope, id))))) throw variantNotFound();
}

/**
 * The smallest mass ratio meeting the criteria on every load case over the detuning band, by the variant's method;
 * with `apply`, the variant's mass ratio becomes it (at the version read).
 */
export async function sizeVariant(
  db: Database,
  engine: EnginePool,
  user: CurrentUser,
  projectId: string,
  id: string,
  body: { apply: boolean; version?: number },
): Promise<VariantSize> {
  const scope = await requireProjectScope(db, user, projectId);
  const record = await requireVariant(db, scope, id);
  if (isManualTuning(record.row.tuning)) {
    throw invalidField('tuning', 'sizing needs a tuning method (den-hartog, warburton-random, ioi-ikeda, hinf or h2); this variant is tuned by hand');
  }
  const input = await computeInputOf(db, scope, { ...record.row, loadCaseIds: record.loadCaseIds });
  let sized: Awaited<ReturnType<typeof computeVariant<'size'>>>;
  try {
    sized = await computeVariant(engine, { kind: 'size', input });
  } catch (error) {
    if (error instanceof ComputeInputError) throw computeRefusal(error);
    throw error;
  }
  if (!body.apply) return { ...sized, applied: false };
  if (!(sized.massRatio > 0)) {
    throw invalidField('apply', 'the bare structure already meets the criteria over the detuning band: there is no mass ratio to apply');
  }
  const variant = await applyChanges(db, engine, user, scope, id, { version: body.version as number, massRatio: sized.massRatio });
  return { ...sized, applied: true, variant };
}

/** Plot data of one of the variant's load cases. */
export async function variantCurves(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, id: string, loadCaseId: string): Promise<VariantCurves> {
  const scope = await requireProjectScope(db, user, projectId);
  const record = await requireVariant(db, scope, id);
  const index = record.loadCaseIds.indexOf(loadCaseId);
  if (index < 0) throw invalidField('loadCaseId', 'is not one of this variant\'s load cases');
  const input = await computeInputOf(db, scope, { ...record.row, loadCaseIds: record.loadCaseIds });
  return curvesOf(engine, input, index);
}

/** The plot data of every load case of the variant, in its order, from its inputs read once (the design report's). */
export async function variantCurvesOfEveryLoadCase(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, id: string): Promise<VariantCurves[]> {
  const scope = await requireProjectScope(db, user, projectId);
  const record = await requireVariant(db, scope, id);
  const input = await computeInputOf(db, scope, { ...record.row, loadCaseIds: record.loadCaseIds });
  const curves: VariantCurves[] = [];
  // One load case after another: each runs on the engine's worker pool.
  for (let index = 0; index < record.loadCaseIds.length; index++) curves.push(await curvesOf(engine, input, index));
  return curves;
}

async function curvesOf(engine: EnginePool, input: Awaited<ReturnType<typeof computeInputOf>>, loadCaseIndex: number): Promise<VariantCurves> {
  try {
    return await computeVariant(engine, { kind: 'curves', input, loadCaseIndex });
  } catch (error) {
    if (error instanceof ComputeInputError) throw computeRefusal(error);
    throw error;
  }
}

/** Why a variant has no result, in words for a 409 (the engine's refusal of its inputs, or none computed yet). */
export function noResultReason(variant: Variant): string {
  return variant.resultError ? `the engine refuses its current inputs (${variant.resultError.message})` : 'it has no computed result';
}
