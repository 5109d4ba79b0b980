import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { Executor } from '../../db/executor';
import { projects, structures } from '../../db/schema';

export type StructureRow = typeof structures.$inferSelect;
export type StructureValues = Pick<StructureRow, 'name' | 'kind' | 'spanM' | 'widthM' | 'deckAreaM2' | 'notes'>;

/** A project of the signed-in person's organisation: every query below is scoped by both. */
export interface ProjectScope {
  organisationId: string;
  projectId: string;
}

/** `column` is the scope's project, and that project is the organisation's (a subquery, so no row of another organisation is ever read). */
export function inProject(db: Executor, column: AnyPgColumn, scope: ProjectScope) {
  return and(
    eq(column, scope.projectId),
    inArray(column, db.select({ id: projects.id }).from(projects).where(and(eq(projects.id, scope.projectId), eq(projects.organisationId, scope.organisationId)))),
  );
}

/** Ids of the structures of the scope's project (a subquery for the tables under a structure). */
export function structureOfProject(db: Executor, scope: ProjectScope & { structureId: string }) {
  return db
    .select({ id: structures.id })
    .from(structures)
    .where(and(eq(structures.id, scope.structureId), inProject(db, structures.projectId, scope)));
}

export function listStructures(db: Executor, scope: ProjectScope): Promise<StructureRow[]> {
  return db.select().from(structures).where(inProject(db, structures.projectId, scope)).orderBy(asc(structures.createdAt), asc(structures.name));
}

export async function findStructure(db: Executor, scope: ProjectScope, id: string): Promise<StructureRow | undefined> {
  const [row] = await db
    .select()
    .from(structures)
    .where(and(eq(structures.id, id), inProject(db, structures.projectId, scope)))
    .limit(1);
  return row;
}

export async function insertStructure(db: Executor, scope: ProjectScope, createdBy: string, values: StructureValues): Promise<StructureRow> {
  const [row] = await db
    .insert(structures)
    .values({ ...values, projectId: scope.projectId, createdBy })
    .returning();
  return row;
}

/** Changes the structure only at `version` (then +1); undefined when nothing matched (absent or stale). */
export async function updateStructureAtVersion(
  db: Executor,
  scope: ProjectScope,
  id: string,
  version: number,
  changes: Partial<StructureValues>,
): Promise<StructureRow | undefined> {
  const [row] = await db
    .update(structures)
    .set({ ...changes, version: sql`${structures.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(structures.id, id), eq(structures.version, version), inProject(db, structures.projectId, scope)))
    .returning();
  return row;
}

/** Deletes the structure with its modes and lumped models (cascade). */
export async function deleteStructure(db: Executor, scope: ProjectScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(structures)
    .where(and(eq(structures.id, id), inProject(db, structures.projectId, scope)))
    .returning({ id: structures.id });
  return rows.length > 0;
}
