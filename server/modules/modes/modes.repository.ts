import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { structureModes } from '../../db/schema';
import { structureOfProject } from '../structures/structures.repository';
import type { StructureScope } from '../lumped-models/lumped-models.repository';

export type ModeRow = typeof structureModes.$inferSelect;
export type ModeValues = Pick<
  ModeRow,
  'label' | 'direction' | 'frequencyHz' | 'modalMassKg' | 'dampingRatio' | 'modeShapeMean' | 'source' | 'lumpedModelId'
>;

function inStructure(db: Executor, scope: StructureScope) {
  return and(eq(structureModes.structureId, scope.structureId), inArray(structureModes.structureId, structureOfProject(db, scope)));
}

export function listModes(db: Executor, scope: StructureScope): Promise<ModeRow[]> {
  return db.select().from(structureModes).where(inStructure(db, scope)).orderBy(asc(structureModes.frequencyHz), asc(structureModes.label));
}

export async function findMode(db: Executor, scope: StructureScope, id: string): Promise<ModeRow | undefined> {
  const [row] = await db
    .select()
    .from(structureModes)
    .where(and(eq(structureModes.id, id), inStructure(db, scope)))
    .limit(1);
  return row;
}

/** The modes derived from a lumped model (of the scope's structure), locked for update until the transaction ends. */
export function listModesOfLumpedModel(db: Executor, scope: StructureScope, modelId: string): Promise<ModeRow[]> {
  return db
    .select()
    .from(structureModes)
    .where(and(eq(structureModes.lumpedModelId, modelId), inStructure(db, scope)))
    .orderBy(asc(structureModes.label))
    .for('update');
}

export async function insertMode(db: Executor, scope: StructureScope, createdBy: string, values: ModeValues): Promise<ModeRow> {
  const [row] = await db
    .insert(structureModes)
    .values({ ...values, structureId: scope.structureId, createdBy })
    .returning();
  return row;
}

/** Changes the mode at `version` (then +1), or at any version when `version` is null (a re-derivation). */
export async function updateModeAtVersion(
  db: Executor,
  scope: StructureScope,
  id: string,
  version: number | null,
  changes: Partial<ModeValues>,
): Promise<ModeRow | undefined> {
  const [row] = await db
    .update(structureModes)
    .set({ ...changes, version: sql`${structureModes.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(structureModes.id, id), version === null ? undefined : eq(structureModes.version, version), inStructure(db, scope)))
    .returning();
  return row;
}

export async function deleteMode(db: Executor, scope: StructureScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(structureModes)
    .where(and(eq(structureModes.id, id), inStructure(db, scope)))
    .returning({ id: structureModes.id });
  return rows.length > 0;
}
