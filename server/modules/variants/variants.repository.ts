import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { comfortCriteria, loadCases, structureModes, structures, tuningVariantLoadCases, tuningVariants } from '../../db/schema';
import { inProject, type ProjectScope } from '../structures/structures.repository';

export type VariantRow = typeof tuningVariants.$inferSelect;
export type VariantValues = Pick<
  VariantRow,
  'name' | 'modeId' | 'criteriaId' | 'massRatio' | 'tuning' | 'unitCount' | 'structureFrequencyToleranceRatio' | 'tmdDampingToleranceRatio' | 'hardware' | 'notes'
>;
export type ComputationValues = Pick<VariantRow, 'result' | 'resultError' | 'inputsHash' | 'engineVersion' | 'computedAt'>;

/** A variant row with its load case ids in order. */
export interface VariantRecord {
  row: VariantRow;
  loadCaseIds: string[];
}

async function withLoadCaseIds(db: Executor, rows: VariantRow[]): Promise<VariantRecord[]> {
  if (!rows.length) return [];
  const links = await db
    .select()
    .from(tuningVariantLoadCases)
    .where(inArray(tuningVariantLoadCases.variantId, rows.map((r) => r.id)))
    .orderBy(asc(tuningVariantLoadCases.variantId), asc(tuningVariantLoadCases.position));
  return rows.map((row) => ({ row, loadCaseIds: links.filter((l) => l.variantId === row.id).map((l) => l.loadCaseId) }));
}

export async function listVariants(db: Executor, scope: ProjectScope): Promise<VariantRecord[]> {
  const rows = await db.select().from(tuningVariants).where(inProject(db, tuningVariants.projectId, scope)).orderBy(asc(tuningVariants.createdAt), asc(tuningVariants.name));
  return withLoadCaseIds(db, rows);
}

export async function findVariant(db: Executor, scope: ProjectScope, id: string): Promise<VariantRecord | undefined> {
  const rows = await db
    .select()
    .from(tuningVariants)
    .where(and(eq(tuningVariants.id, id), inProject(db, tuningVariants.projectId, scope)))
    .limit(1);
  return (await withLoadCaseIds(db, rows))[0];
}

async function replaceLoadCaseIds(db: Executor, variantId: string, loadCaseIds: readonly string[]): Promise<void> {
  await db.delete(tuningVariantLoadCases).where(eq(tuningVariantLoadCases.variantId, variantId));
  await db.insert(tuningVariantLoadCases).values(loadCaseIds.map((loadCaseId, position) => ({ variantId, position, loadCaseId })));
}

export async function insertVariant(
  db: Executor,
  scope: ProjectScope,
  createdBy: string,
  values: VariantValues & ComputationValues,
  loadCaseIds: readonly string[],
): Promise<VariantRecord> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(tuningVariants)
      .values({ ...values, projectId: scope.projectId, createdBy })
      .returning();
    await replaceLoadCaseIds(tx, row.id, loadCaseIds);
    return { row, loadCaseIds: [...loadCaseIds] };
  });
}

/** Changes the variant at `version` (then +1), with its load cases when given; undefined when absent or stale. */
export async function updateVariantAtVersion(
  db: Executor,
  scope: ProjectScope,
  id: string,
  version: number,
  changes: Partial<VariantValues> & ComputationValues,
  loadCaseIds: readonly string[] | undefined,
): Promise<VariantRecord | undefined> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(tuningVariants)
      .set({ ...changes, version: sql`${tuningVariants.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(tuningVariants.id, id), eq(tuningVariants.version, version), inProject(tx, tuningVariants.projectId, scope)))
      .returning();
    if (!row) return undefined;
    if (loadCaseIds) await replaceLoadCaseIds(tx, id, loadCaseIds);
    return (await withLoadCaseIds(tx, [row]))[0];
  });
}

/**
 * Stores a recomputed result for the variant as it was at `version` (its version does not change: the variant's own
 * fields did not). Nothing is stored when the variant moved on meanwhile.
 */
export async function storeComputation(db: Executor, id: string, version: number, values: ComputationValues): Promise<void> {
  await db
    .update(tuningVariants)
    .set(values)
    .where(and(eq(tuningVariants.id, id), eq(tuningVariants.version, version)));
}

export async function deleteVariant(db: Executor, scope: ProjectScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(tuningVariants)
    .where(and(eq(tuningVariants.id, id), inProject(db, tuningVariants.projectId, scope)))
    .returning({ id: tuningVariants.id });
  return rows.length > 0;
}

// ---------- the things a variant points at, within the scope's project ----------

export async function findProjectMode(db: Executor, scope: ProjectScope, modeId: string) {
  const [row] = await db
    .select({ mode: structureModes })
    .from(structureModes)
    .innerJoin(structures, eq(structures.id, structureModes.structureId))
    .where(and(eq(structureModes.id, modeId), inProject(db, structures.projectId, scope)))
    .limit(1);
  return row?.mode;
}

export function findProjectLoadCases(db: Executor, scope: ProjectScope, ids: readonly string[]) {
  if (!ids.length) return Promise.resolve([]);
  return db
    .select()
    .from(loadCases)
    .where(and(inArray(loadCases.id, [...ids]), inProject(db, loadCases.projectId, scope)));
}

export async function findProjectCriteria(db: Executor, scope: ProjectScope, id: string) {
  const [row] = await db
    .select()
    .from(comfortCriteria)
    .where(and(eq(comfortCriteria.id, id), inProject(db, comfortCriteria.projectId, scope)))
    .limit(1);
  return row;
}
