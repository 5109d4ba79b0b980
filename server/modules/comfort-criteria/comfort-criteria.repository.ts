import { and, asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { comfortCriteria } from '../../db/schema';
import { inProject, type ProjectScope } from '../structures/structures.repository';

export type ComfortCriteriaRow = typeof comfortCriteria.$inferSelect;
export type ComfortCriteriaValues = Pick<ComfortCriteriaRow, 'name' | 'spec'>;

export function listComfortCriteria(db: Executor, scope: ProjectScope): Promise<ComfortCriteriaRow[]> {
  return db.select().from(comfortCriteria).where(inProject(db, comfortCriteria.projectId, scope)).orderBy(asc(comfortCriteria.createdAt), asc(comfortCriteria.name));
}

export async function findComfortCriteria(db: Executor, scope: ProjectScope, id: string): Promise<ComfortCriteriaRow | undefined> {
  const [row] = await db
    .select()
    .from(comfortCriteria)
    .where(and(eq(comfortCriteria.id, id), inProject(db, comfortCriteria.projectId, scope)))
    .limit(1);
  return row;
}

export async function insertComfortCriteria(db: Executor, scope: ProjectScope, createdBy: string, values: ComfortCriteriaValues): Promise<ComfortCriteriaRow> {
  const [row] = await db
    .insert(comfortCriteria)
    .values({ ...values, projectId: scope.projectId, createdBy })
    .returning();
  return row;
}

export async function updateComfortCriteriaAtVersion(
  db: Executor,
  scope: ProjectScope,
  id: string,
  version: number,
  changes: Partial<ComfortCriteriaValues>,
): Promise<ComfortCriteriaRow | undefined> {
  const [row] = await db
    .update(comfortCriteria)
    .set({ ...changes, version: sql`${comfortCriteria.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(comfortCriteria.id, id), eq(comfortCriteria.version, version), inProject(db, comfortCriteria.projectId, scope)))
    .returning();
  return row;
}

export async function deleteComfortCriteria(db: Executor, scope: ProjectScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(comfortCriteria)
    .where(and(eq(comfortCriteria.id, id), inProject(db, comfortCriteria.projectId, scope)))
    .returning({ id: comfortCriteria.id });
  return rows.length > 0;
}
