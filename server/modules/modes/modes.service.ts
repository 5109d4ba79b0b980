import type { Database } from '../../db/client';
import type { Executor } from '../../db/executor';
import { invalidField, notFound } from '../../lib/http-error';
import { givenFields, nothingToChange, versionConflict } from '../../lib/versioned';
import type { CurrentUser } from '../../middleware/auth';
import { derivedModeFields, type CreateModeParsed, type ModeSource, type SavedMode, type UpdateModeParsed } from '../../../shared/contracts/model';
import { deriveBeamMode } from '../../../shared/engine/beam';
import { EngineInputError } from '../../../shared/engine/linalg';
import { solveModes } from '../../../shared/engine/modal';
import { deriveFromLumpedModel, derivedNumbersProblem } from '../lumped-models/lumped-model-modes';
import { findLumpedModel, type StructureScope } from '../lumped-models/lumped-models.repository';
import { requireStructure } from '../structures/structures.service';
import * as repository from './modes.repository';
import { deleteUnlessUsedByVariants } from '../variants/variant-usage';
import { frozenWrite, refuseIfFrozen } from '../sign-offs/freeze';
import { asActor } from '../../db/actor';

export function toSavedMode(row: repository.ModeRow, projectId: string): SavedMode {
  return {
    id: row.id,
    projectId,
    structureId: row.structureId,
    label: row.label,
    direction: row.direction as SavedMode['direction'],
    frequencyHz: row.frequencyHz,
    modalMassKg: row.modalMassKg,
    dampingRatio: row.dampingRatio,
    modeShapeMean: row.modeShapeMean,
    source: row.source,
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const modeNotFound = () => notFound('The mode', 'mode_not_found');

interface DerivedValues {
  frequencyHz: number;
  modalMassKg: number;
  /** Given by a beam source only. */
  modeShapeMean?: number;
  lumpedModelId: string | null;
}

/**
 * The numbers a derived source gives (null for a typed mode). A lumped model is read with a share lock, so that it
 * cannot change before this transaction commits the mode derived from it (its PATCH re-derives the modes it sees).
 */
export async function deriveModeValues(db: Executor, scope: StructureScope, source: ModeSource): Promise<DerivedValues | null> {
  if (source.kind === 'typed') return null;
  if (source.kind === 'beam') {
    try {
      const beam = deriveBeamMode(source);
      const outside = derivedNumbersProblem(beam.frequencyHz, beam.modalMassKg);
      if (outside) throw invalidField('source', `the beam ${outside.message}`);
      return { frequencyHz: beam.frequencyHz, modalMassKg: beam.modalMassKg, modeShapeMean: beam.modeShapeMean, lumpedModelId: null };
    } catch (error) {
      if (error instanceof EngineInputError) throw invalidField(`source.${error.field}`, error.message.replace(/^[^:]*:\s*/, ''));
      throw error;
    }
  }
  const model = await findLumpedModel(db, scope, source.modelId, 'share');
  if (!model) throw invalidField('source.modelId', 'is not a lumped model of this structure');
  const derived = deriveFromLumpedModel(solveModes(model.massMatrixKg, model.stiffnessMatrixNPerM), source.modeNumber, source.dofIndex);
  if (!derived.ok) throw invalidField(`source.${derived.field}`, derived.message);
  return { frequencyHz: derived.frequencyHz, modalMassKg: derived.modalMassKg, lumpedModelId: model.id };
}

async function structureScope(db: Database, user: CurrentUser, projectId: string, structureId: string): Promise<StructureScope> {
  await requireStructure(db, user, projectId, structureId);
  return { organisationId: user.organisationId, projectId, structureId };
}

export async function listModes(db: Database, user: CurrentUser, projectId: string, structureId: string): Promise<SavedMode[]> {
  const scope = await structureScope(db, user, projectId, structureId);
  return (await repository.listModes(db, scope)).map((row) => toSavedMode(row, projectId));
}

export async function getMode(db: Database, user: CurrentUser, projectId: string, structureId: string, id: string): Promise<SavedMode> {
  const scope = await structureScope(db, user, projectId, structureId);
  const row = await repository.findMode(db, scope, id);
  if (!row) throw modeNotFound();
  return toSavedMode(row, projectId);
}

export async function createMode(db: Database, user: CurrentUser, projectId: string, structureId: string, input: CreateModeParsed): Promise<SavedMode> {
  const scope = await structureScope(db, user, projectId, structureId);
  const row = await asActor(db, user, async (tx) => {
    const derived = await deriveModeValues(tx, scope, input.source);
    // A typed mode has both numbers (the contract requires them); a derived one takes them from its source.
    const frequencyHz = derived?.frequencyHz ?? input.frequencyHz;
    const modalMassKg = derived?.modalMassKg ?? input.modalMassKg;
    if (frequencyHz === undefined || modalMassKg === undefined) throw invalidField(frequencyHz === undefined ? 'frequencyHz' : 'modalMassKg', 'is required for a typed mode');
    return repository.insertMode(tx, scope, user.id, {
      label: input.label,
      direction: input.direction,
      frequencyHz,
      modalMassKg,
      dampingRatio: input.dampingRatio,
      modeShapeMean: derived?.modeShapeMean ?? input.modeShapeMean ?? null,
      source: input.source,
      lumpedModelId: derived?.lumpedModelId ?? null,
    });
  });
  return toSavedMode(row, projectId);
}

/**
 * A new source replaces the old: a derived one re-derives the numbers, `typed` keeps the last numbers unless new
 * ones are given. While the mode stays derived its derived numbers cannot be typed over (400 naming the field).
 */
export async function updateMode(
  db: Database,
  user: CurrentUser,
  projectId: string,
  structureId: string,
  id: string,
  input: UpdateModeParsed,
): Promise<SavedMode> {
  const scope = await structureScope(db, user, projectId, structureId);
  const { version, source, ...fields } = input;
  const changes: Partial<repository.ModeValues> = givenFields(fields);
  if (Object.keys(changes).length === 0 && source === undefined) {
    throw nothingToChange(['label', 'direction', 'frequencyHz', 'modalMassKg', 'dampingRatio', 'modeShapeMean', 'source']);
  }
  const row = await asActor(db, user, async (tx) => {
    const current = await repository.findMode(tx, scope, id);
    if (!current) throw modeNotFound();
    await refuseIfFrozen(tx, 'The mode', { modeId: id });
    if (current.version !== version) throw versionConflict('The mode', version, current.version);
    if (source === undefined) {
      for (const field of derivedModeFields[current.source.kind]) {
        if (changes[field] !== undefined) {
          throw invalidField(field, `is derived from the mode's ${current.source.kind} source: change the source, or set it to { "kind": "typed" } to type the numbers`);
        }
      }
    } else {
      const derived = await deriveModeValues(tx, scope, source);
      changes.source = source;
      changes.lumpedModelId = derived?.lumpedModelId ?? null;
      if (derived) {
        changes.frequencyHz = derived.frequencyHz;
        changes.modalMassKg = derived.modalMassKg;
        if (derived.modeShapeMean !== undefined) changes.modeShapeMean = derived.modeShapeMean;
        // A mean |φ| that a beam gave does not belong to the lumped model's mode.
        else if (current.source.kind === 'beam' && changes.modeShapeMean === undefined) changes.modeShapeMean = null;
      }
    }
    const updated = await frozenWrite('The mode', () => repository.updateModeAtVersion(tx, scope, id, version, changes));
    if (!updated) {
      const now = await repository.findMode(tx, scope, id);
      if (!now) throw modeNotFound();
      throw versionConflict('The mode', version, now.version);
    }
    return updated;
  });
  return toSavedMode(row, projectId);
}

export async function deleteMode(db: Database, user: CurrentUser, projectId: string, structureId: string, id: string): Promise<void> {
  const scope = await structureScope(db, user, projectId, structureId);
  await refuseIfFrozen(db, 'The mode', { modeId: id }, () => repository.findMode(db, scope, id));
  const deleted = await deleteUnlessUsedByVariants(db, 'The mode', { modeId: id }, () => frozenWrite('The mode', () => asActor(db, user, (tx) => repository.deleteMode(tx, scope, id))));
  if (!deleted) throw modeNotFound();
}
