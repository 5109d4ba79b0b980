import type { Database } from '../../db/client';
import { HttpError, notFound } from '../../lib/http-error';
import { FOREIGN_KEY_VIOLATION, pgErrorCode } from '../../lib/pg-errors';
import { givenFields, nothingToChange, versionConflict } from '../../lib/versioned';
import type { CurrentUser } from '../../middleware/auth';
import type { ApiIssue } from '../../../shared/contracts/errors';
import type { CreateLumpedModelInput, LumpedModel, UpdateLumpedModelInput } from '../../../shared/contracts/model';
import { solveModes, type ModalSolution } from '../../../shared/engine/modal';
import { frozenWrite } from '../sign-offs/freeze';
import { listModesOfLumpedModel, updateModeAtVersion, type ModeRow } from '../modes/modes.repository';
import { requireStructure } from '../structures/structures.service';
import { deriveFromLumpedModel, modesOf, solveLumpedModel } from './lumped-model-modes';
import * as repository from './lumped-models.repository';
import { asActor } from '../../db/actor';

export function toLumpedModel(row: repository.LumpedModelRow, projectId: string, solution?: ModalSolution): LumpedModel {
  return {
    id: row.id,
    projectId,
    structureId: row.structureId,
    name: row.name,
    massMatrixKg: row.massMatrixKg,
    stiffnessMatrixNPerM: row.stiffnessMatrixNPerM,
    dofLabels: row.dofLabels,
    // Stored matrices passed the same checks on the way in.
    modes: modesOf(solution ?? solveModes(row.massMatrixKg, row.stiffnessMatrixNPerM)),
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const modelNotFound = () => notFound('The lumped model', 'model_not_found');

async function structureScope(db: Database, user: CurrentUser, projectId: string, structureId: string): Promise<repository.StructureScope> {
  await requireStructure(db, user, projectId, structureId);
  return { organisationId: user.organisationId, projectId, structureId };
}

function usedBy(modes: ModeRow[]): HttpError {
  const names = modes.map((mode) => `"${mode.label}"`).join(', ');
  return new HttpError(
    409,
    'model_in_use',
    `The lumped model is used by ${modes.length === 1 ? 'the mode' : 'the modes'} ${names}: delete ${modes.length === 1 ? 'it' : 'them'} or change ${modes.length === 1 ? 'its' : 'their'} source first`,
    modes.map((mode) => ({ path: `modes.${mode.id}`, message: `mode "${mode.label}" (${mode.id}) takes its numbers from this model` })),
  );
}

export async function listLumpedModels(db: Database, user: CurrentUser, projectId: string, structureId: string): Promise<LumpedModel[]> {
  const scope = await structureScope(db, user, projectId, structureId);
  return (await repository.listLumpedModels(db, scope)).map((row) => toLumpedModel(row, projectId));
}

export async function getLumpedModel(db: Database, user: CurrentUser, projectId: string, structureId: string, id: string): Promise<LumpedModel> {
  const scope = await structureScope(db, user, projectId, structureId);
  const row = await repository.findLumpedModel(db, scope, id);
  if (!row) throw modelNotFound();
  return toLumpedModel(row, projectId);
}

export async function createLumpedModel(
  db: Database,
  user: CurrentUser,
  projectId: string,
  structureId: string,
  input: CreateLumpedModelInput,
): Promise<LumpedModel> {
  const scope = await structureScope(db, user, projectId, structureId);
  const solution = solveLumpedModel(input.massMatrixKg, input.stiffnessMatrixNPerM, input.dofLabels);
  const row = await asActor(db, user, (tx) => repository.insertLumpedModel(tx, scope, user.id, {
    name: input.name,
    massMatrixKg: input.massMatrixKg,
    stiffnessMatrixNPerM: input.stiffnessMatrixNPerM,
    dofLabels: input.dofLabels ?? null,
  }));
  return toLumpedModel(row, projectId, solution);
}

/**
 * Changes the model and, in the same transaction, re-derives every mode taken from it. A mode whose mode number or
 * DOF no longer exists (or is now a node) makes the whole change fail with 409 naming the mode; nothing changes.
 */
export async function updateLumpedModel(
  db: Database,
  user: CurrentUser,
  projectId: string,
  structureId: string,
  id: string,
  input: UpdateLumpedModelInput,
): Promise<LumpedModel> {
  const scope = await structureScope(db, user, projectId, structureId);
  const { version, ...fields } = input;
  const changes = givenFields(fields);
  if (Object.keys(changes).length === 0) throw nothingToChange(['name', 'massMatrixKg', 'stiffnessMatrixNPerM', 'dofLabels']);
  const { row, solution } = await asActor(db, user, async (tx) => {
    const current = await repository.findLumpedModel(tx, scope, id);
    if (!current) throw modelNotFound();
    if (current.version !== version) throw versionConflict('The lumped model', version, current.version);
    const matricesChange = changes.massMatrixKg !== undefined || changes.stiffnessMatrixNPerM !== undefined;
    const solution = solveLumpedModel(
      changes.massMatrixKg ?? current.massMatrixKg,
      changes.stiffnessMatrixNPerM ?? current.stiffnessMatrixNPerM,
      changes.dofLabels === undefined ? current.dofLabels : changes.dofLabels,
    );
    const row = await repository.updateLumpedModelAtVersion(tx, scope, id, version, changes);
    if (!row) {
      const now = await repository.findLumpedModel(tx, scope, id);
      if (!now) throw modelNotFound();
      throw versionConflict('The lumped model', version, now.version);
    }
    if (matricesChange) {
      const modes = await listModesOfLumpedModel(tx, scope, id);
      const refusals: ApiIssue[] = [];
      for (const mode of modes) {
        if (mode.source.kind !== 'lumped-model') continue;
        const derived = deriveFromLumpedModel(solution, mode.source.modeNumber, mode.source.dofIndex);
        if (!derived.ok) {
          const path = `modes.${mode.id}.source.${derived.field}`;
          refusals.push({
            path,
            message: `mode "${mode.label}" takes mode ${mode.source.modeNumber} at DOF ${mode.source.dofIndex} of this model; after the change its ${derived.field} ${derived.message}`,
          });
          continue;
        }
        await frozenWrite(`The mode "${mode.label}" taken from this model`, () =>
          updateModeAtVersion(tx, scope, mode.id, null, { frequencyHz: derived.frequencyHz, modalMassKg: derived.modalMassKg }),
        );
      }
      if (refusals.length > 0) {
        throw new HttpError(
          409,
          'derived_mode_conflict',
          `The change would leave ${refusals.length === 1 ? 'a mode' : `${refusals.length} modes`} taken from this model without ${refusals.length === 1 ? 'its' : 'their'} mode or DOF: ${refusals.map((r) => r.message).join('; ')}. Change or delete ${refusals.length === 1 ? 'that mode' : 'those modes'} first; nothing was changed`,
          refusals,
        );
      }
    }
    return { row, solution };
  });
  return toLumpedModel(row, projectId, solution);
}

/** Refused (409 model_in_use, naming them) while modes take their numbers from the model. */
export async function deleteLumpedModel(db: Database, user: CurrentUser, projectId: string, structureId: string, id: string): Promise<void> {
  const scope = await structureScope(db, user, projectId, structureId);
  try {
    await asActor(db, user, async (tx) => {
      if (!(await repository.findLumpedModel(tx, scope, id))) throw modelNotFound();
      const modes = await listModesOfLumpedModel(tx, scope, id);
      if (modes.length > 0) throw usedBy(modes);
      if (!(await repository.deleteLumpedModel(tx, scope, id))) throw modelNotFound();
    });
  } catch (error) {
    // A mode derived from the model committed between the check and the delete: the foreign key refuses it.
    if (pgErrorCode(error) === FOREIGN_KEY_VIOLATION) {
      throw new HttpError(409, 'model_in_use', 'The lumped model is used by a mode that was just derived from it: reload the modes', [
        { path: 'modes', message: 'a mode takes its numbers from this model' },
      ]);
    }
    throw error;
  }
}
