import type { Database } from '../../db/client';
import { notFound } from '../../lib/http-error';
import { givenFields, nothingToChange, versionConflict } from '../../lib/versioned';
import type { CurrentUser } from '../../middleware/auth';
import { createLoadCaseSchema, updateLoadCaseSchema, type SavedLoadCase } from '../../../shared/contracts/model';
import type { z } from 'zod';
import { requireProjectScope } from '../structures/structures.service';
import * as repository from './load-cases.repository';
import { frozenWrite, refuseIfFrozen } from '../sign-offs/freeze';
import { deleteUnlessUsedByVariants } from '../variants/variant-usage';
import { asActor } from '../../db/actor';

type CreateLoadCaseParsed = z.output<typeof createLoadCaseSchema>;
type UpdateLoadCaseParsed = z.output<typeof updateLoadCaseSchema>;

export function toSavedLoadCase(row: repository.LoadCaseRow): SavedLoadCase {
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    spec: row.spec,
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const loadCaseNotFound = () => notFound('The load case', 'load_case_not_found');

export async function listLoadCases(db: Database, user: CurrentUser, projectId: string): Promise<SavedLoadCase[]> {
  const scope = await requireProjectScope(db, user, projectId);
  return (await repository.listLoadCases(db, scope)).map(toSavedLoadCase);
}

export async function getLoadCase(db: Database, user: CurrentUser, projectId: string, id: string): Promise<SavedLoadCase> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findLoadCase(db, scope, id);
  if (!row) throw loadCaseNotFound();
  return toSavedLoadCase(row);
}

/** The spec is stored as the engine's schema parsed it (its defaults filled in). */
export async function createLoadCase(db: Database, user: CurrentUser, projectId: string, input: CreateLoadCaseParsed): Promise<SavedLoadCase> {
  const scope = await requireProjectScope(db, user, projectId);
  return toSavedLoadCase(await asActor(db, user, (tx) => repository.insertLoadCase(tx, scope, user.id, { name: input.name, spec: input.spec })));
}

export async function updateLoadCase(db: Database, user: CurrentUser, projectId: string, id: string, input: UpdateLoadCaseParsed): Promise<SavedLoadCase> {
  const scope = await requireProjectScope(db, user, projectId);
  const { version, ...fields } = input;
  const changes = givenFields(fields);
  if (Object.keys(changes).length === 0) throw nothingToChange(['name', 'spec']);
  await refuseIfFrozen(db, 'The load case', { loadCaseId: id }, () => repository.findLoadCase(db, scope, id));
  const row = await frozenWrite('The load case', () => asActor(db, user, (tx) => repository.updateLoadCaseAtVersion(tx, scope, id, version, changes)));
  if (row) return toSavedLoadCase(row);
  const current = await repository.findLoadCase(db, scope, id);
  if (!current) throw loadCaseNotFound();
  throw versionConflict('The load case', version, current.version);
}

export async function deleteLoadCase(db: Database, user: CurrentUser, projectId: string, id: string): Promise<void> {
  const scope = await requireProjectScope(db, user, projectId);
  await refuseIfFrozen(db, 'The load case', { loadCaseId: id }, () => repository.findLoadCase(db, scope, id));
  const deleted = await deleteUnlessUsedByVariants(db, 'The load case', { loadCaseId: id }, () => frozenWrite('The load case', () => asActor(db, user, (tx) => repository.deleteLoadCase(tx, scope, id))));
  if (!deleted) throw loadCaseNotFound();
}
