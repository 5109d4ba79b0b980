import { and, asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { loadCases } from '../../db/schema';
import { inProject, type ProjectScope } from '../structures/structures.repository';

export type LoadCaseRow = typeof loadCases.$inferSelect;
export type LoadCaseValues = Pick<LoadCaseRow, 'name' | 'spec'>;

export function listLoadCases(db: Executor, scope: ProjectScope): Promise<LoadCaseRow[]> {
  return db.select().from(loadCases).where(inProject(db, loadCases.projectId, scope)).orderBy(asc(loadCases.createdAt), asc(loadCases.name));
}

export async function findLoadCase(db: Executor, scope: ProjectScope, id: string): Promise<LoadCaseRow | undefined> {
  const [row] = await db
    .select()
    .from(loadCases)
    .where(and(eq(loadCases.id, id), inProject(db, loadCases.projectId, scope)))
    .limit(1);
  return row;
}

export async function insertLoadCase(db: Executor, scope: ProjectScope, createdBy: string, values: LoadCaseValues): Promise<LoadCaseRow> {
  const [row] = await db
    .insert(loadCases)
    .values({ ...values, projectId: scope.projectId, createdBy })
    .returning();
  return row;
}

export async function updateLoadCaseAtVersion(
  db: Executor,
  scope: ProjectScope,
  id: string,
  version: number,
  changes: Partial<LoadCaseValues>,
): Promise<LoadCaseRow | undefined> {
  const [row] = await db
    .update(loadCases)
    .set({ ...changes, version: sql`${loadCases.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(loadCases.id, id), eq(loadCases.version, version), inProject(db, loadCases.projectId, scope)))
    .returning();
  return row;
}

export async function deleteLoadCase(db: Executor, scope: ProjectScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(loadCases)
    .where(and(eq(loadCases.id, id), inProject(db, loadCases.projectId, scope)))
    .returning({ id: loadCases.id });
  return rows.length > 0;
}
