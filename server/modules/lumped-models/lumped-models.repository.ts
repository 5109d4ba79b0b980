import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { lumpedModels } from '../../db/schema';
import { structureOfProject, type ProjectScope } from '../structures/structures.repository';

export type LumpedModelRow = typeof lumpedModels.$inferSelect;
export type LumpedModelValues = Pick<LumpedModelRow, 'name' | 'massMatrixKg' | 'stiffnessMatrixNPerM' | 'dofLabels'>;
export type StructureScope = ProjectScope & { structureId: string };

function inStructure(db: Executor, scope: StructureScope) {
  return and(eq(lumpedModels.structureId, scope.structureId), inArray(lumpedModels.structureId, structureOfProject(db, scope)));
}

export function listLumpedModels(db: Executor, scope: StructureScope): Promise<LumpedModelRow[]> {
  return db.select().from(lumpedModels).where(inStructure(db, scope)).orderBy(asc(lumpedModels.createdAt), asc(lumpedModels.name));
}

/** The model if it is the structure's; `lock: 'share'` keeps it unchanged until the transaction ends. */
export async function findLumpedModel(db: Executor, scope: StructureScope, id: string, lock?: 'share'): Promise<LumpedModelRow | undefined> {
  const query = db
    .select()
    .from(lumpedModels)
    .where(and(eq(lumpedModels.id, id), inStructure(db, scope)))
    .limit(1);
  const [row] = lock ? await query.for(lock) : await query;
  return row;
}

export async function insertLumpedModel(db: Executor, scope: StructureScope, createdBy: string, values: LumpedModelValues): Promise<LumpedModelRow> {
  const [row] = await db
    .insert(lumpedModels)
    .values({ ...values, structureId: scope.structureId, createdBy })
    .returning();
  return row;
}

export async function updateLumpedModelAtVersion(
  db: Executor,
  scope: StructureScope,
  id: string,
  version: number,
  changes: Partial<LumpedModelValues>,
): Promise<LumpedModelRow | undefined> {
  const [row] = await db
    .update(lumpedModels)
    .set({ ...changes, version: sql`${lumpedModels.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(lumpedModels.id, id), eq(lumpedModels.version, version), inStructure(db, scope)))
    .returning();
  return row;
}

export async function deleteLumpedModel(db: Executor, scope: StructureScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(lumpedModels)
    .where(and(eq(lumpedModels.id, id), inStructure(db, scope)))
    .returning({ id: lumpedModels.id });
  return rows.length > 0;
}
