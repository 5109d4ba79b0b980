import type { z } from 'zod';
import type { Database } from '../../db/client';
import { notFound } from '../../lib/http-error';
import { givenFields, nothingToChange, versionConflict } from '../../lib/versioned';
import type { CurrentUser } from '../../middleware/auth';
import { createComfortCriteriaSchema, updateComfortCriteriaSchema, type ComfortCriteria } from '../../../shared/contracts/model';
import { requireProjectScope } from '../structures/structures.service';
import * as repository from './comfort-criteria.repository';
import { deleteUnlessUsedByVariants } from '../variants/variant-usage';
import { frozenWrite, refuseIfFrozen } from '../sign-offs/freeze';
import { asActor } from '../../db/actor';

type CreateComfortCriteriaParsed = z.output<typeof createComfortCriteriaSchema>;
type UpdateComfortCriteriaParsed = z.output<typeof updateComfortCriteriaSchema>;

export function toComfortCriteria(row: repository.ComfortCriteriaRow): ComfortCriteria {
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    spec: row.spec,
    status: row.status,
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const criteriaNotFound = () => notFound('The comfort criteria', 'comfort_criteria_not_found');

export async function listComfortCriteria(db: Database, user: CurrentUser, projectId: string): Promise<ComfortCriteria[]> {
  const scope = await requireProjectScope(db, user, projectId);
  return (await repository.listComfortCriteria(db, scope)).map(toComfortCriteria);
}

export async function getComfortCriteria(db: Database, user: CurrentUser, projectId: string, id: string): Promise<ComfortCriteria> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findComfortCriteria(db, scope, id);
  if (!row) throw criteriaNotFound();
  return toComfortCriteria(row);
}

/** New criteria are drafts; only sign-off moves the status. */
export async function createComfortCriteria(db: Database, user: CurrentUser, projectId: string, input: CreateComfortCriteriaParsed): Promise<ComfortCriteria> {
  const scope = await requireProjectScope(db, user, projectId);
  return toComfortCriteria(await asActor(db, user, (tx) => repository.insertComfortCriteria(tx, scope, user.id, { name: input.name, spec: input.spec })));
}

export async function updateComfortCriteria(
  db: Database,
  user: CurrentUser,
  projectId: string,
  id: string,
  input: UpdateComfortCriteriaParsed,
): Promise<ComfortCriteria> {
  const scope = await requireProjectScope(db, user, projectId);
  const { version, ...fields } = input;
  const changes = givenFields(fields);
  if (Object.keys(changes).length === 0) throw nothingToChange(['name', 'spec']);
  await refuseIfFrozen(db, 'This set of comfort criteria', { criteriaId: id }, () => repository.findComfortCriteria(db, scope, id));
  const row = await frozenWrite('This set of comfort criteria', () => asActor(db, user, (tx) => repository.updateComfortCriteriaAtVersion(tx, scope, id, version, changes)));
  if (row) return toComfortCriteria(row);
  const current = await repository.findComfortCriteria(db, scope, id);
  if (!current) throw criteriaNotFound();
  throw versionConflict('The comfort criteria', version, current.version);
}

export async function deleteComfortCriteria(db: Database, user: CurrentUser, projectId: string, id: string): Promise<void> {
  const scope = await requireProjectScope(db, user, projectId);
  await refuseIfFrozen(db, 'This set of comfort criteria', { criteriaId: id }, () => repository.findComfortCriteria(db, scope, id));
  const deleted = await deleteUnlessUsedByVariants(db, 'The comfort criteria', { criteriaId: id }, () =>
    frozenWrite('This set of comfort criteria', () => asActor(db, user, (tx) => repository.deleteComfortCriteria(tx, scope, id))),
  );
  if (!deleted) throw criteriaNotFound();
}
