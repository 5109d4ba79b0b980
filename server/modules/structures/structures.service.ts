import { notFound } from '../../lib/http-error';
import { givenFields, nothingToChange, versionConflict } from '../../lib/versioned';
import type { CurrentUser } from '../../middleware/auth';
import type { CreateStructureInput, Structure, UpdateStructureInput } from '../../../shared/contracts/model';
import type { Database } from '../../db/client';
import { requireProject } from '../projects/projects.service';
import * as repository from './structures.repository';
import { deleteUnlessUsedByVariants } from '../variants/variant-usage';
import { asActor } from '../../db/actor';

export function toStructure(row: repository.StructureRow): Structure {
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    kind: row.kind,
    spanM: row.spanM,
    widthM: row.widthM,
    deckAreaM2: row.deckAreaM2,
    notes: row.notes,
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export const structureNotFound = () => notFound('The structure', 'structure_not_found');

/** The project's scope after checking that it is the person's organisation's (404 project_not_found otherwise). */
export async function requireProjectScope(db: Database, user: CurrentUser, projectId: string): Promise<repository.ProjectScope> {
  await requireProject(db, user, projectId);
  return { organisationId: user.organisationId, projectId };
}

/** The structure's row if it belongs to the project (and the project to the person's organisation); else 404. */
export async function requireStructure(db: Database, user: CurrentUser, projectId: string, structureId: string): Promise<repository.StructureRow> {
  await requireProject(db, user, projectId);
  const row = await repository.findStructure(db, { organisationId: user.organisationId, projectId }, structureId);
  if (!row) throw structureNotFound();
  return row;
}

export async function listStructures(db: Database, user: CurrentUser, projectId: string): Promise<Structure[]> {
  const scope = await requireProjectScope(db, user, projectId);
  return (await repository.listStructures(db, scope)).map(toStructure);
}

export async function getStructure(db: Database, user: CurrentUser, projectId: string, id: string): Promise<Structure> {
  return toStructure(await requireStructure(db, user, projectId, id));
}

export async function createStructure(db: Database, user: CurrentUser, projectId: string, input: CreateStructureInput): Promise<Structure> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await asActor(db, user, (tx) => repository.insertStructure(tx, scope, user.id, {
    name: input.name,
    kind: input.kind,
    spanM: input.spanM ?? null,
    widthM: input.widthM ?? null,
    deckAreaM2: input.deckAreaM2 ?? null,
    notes: input.notes || null,
  }));
  return toStructure(row);
}

export async function updateStructure(db: Database, user: CurrentUser, projectId: string, id: string, input: UpdateStructureInput): Promise<Structure> {
  const scope = await requireProjectScope(db, user, projectId);
  const { version, ...fields } = input;
  const changes = givenFields(fields);
  if (changes.notes === '') changes.notes = null;
  if (Object.keys(changes).length === 0) throw nothingToChange(['name', 'kind', 'spanM', 'widthM', 'deckAreaM2', 'notes']);
  const row = await asActor(db, user, (tx) => repository.updateStructureAtVersion(tx, scope, id, version, changes));
  if (row) return toStructure(row);
  const current = await repository.findStructure(db, scope, id);
  if (!current) throw structureNotFound();
  throw versionConflict('The structure', version, current.version);
}

export async function deleteStructure(db: Database, user: CurrentUser, projectId: string, id: string): Promise<void> {
  const scope = await requireProjectScope(db, user, projectId);
  // Deleting a structure deletes its modes: refused while a tuning variant uses one of them.
  const deleted = await deleteUnlessUsedByVariants(db, 'A mode of the structure', { structureId: id }, () => asActor(db, user, (tx) => repository.deleteStructure(tx, scope, id)));
  if (!deleted) throw structureNotFound();
}
