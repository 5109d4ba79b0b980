import { and, desc, eq, getTableColumns, sql } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { siteRecords } from '../../db/schema';
import { inProject, type ProjectScope } from '../structures/structures.repository';

export type SiteRecordRow = typeof siteRecords.$inferSelect;
/** A row without the raw file (lists and reads never need it). */
export type SiteRecordSummaryRow = Omit<SiteRecordRow, 'fileBytes'> & { fileSizeBytes: number };
export type SiteRecordValues = Omit<SiteRecordRow, 'id' | 'projectId' | 'version' | 'createdBy' | 'createdAt' | 'updatedAt'>;

const { fileBytes: _fileBytes, ...summaryColumns } = getTableColumns(siteRecords);
const summary = { ...summaryColumns, fileSizeBytes: sql<number>`octet_length(${siteRecords.fileBytes})`.mapWith(Number) };

export function listSiteRecords(db: Executor, scope: ProjectScope): Promise<SiteRecordSummaryRow[]> {
  return db
    .select(summary)
    .from(siteRecords)
    .where(inProject(db, siteRecords.projectId, scope))
    .orderBy(desc(siteRecords.createdAt));
}

export async function findSiteRecord(db: Executor, scope: ProjectScope, id: string): Promise<SiteRecordSummaryRow | undefined> {
  const [row] = await db
    .select(summary)
    .from(siteRecords)
    .where(and(eq(siteRecords.id, id), inProject(db, siteRecords.projectId, scope)))
    .limit(1);
  return row;
}

/** The stored file of a record, for a new analysis. */
export async function findSiteRecordFile(db: Executor, scope: ProjectScope, id: string): Promise<SiteRecordRow | undefined> {
  const [row] = await db
    .select()
    .from(siteRecords)
    .where(and(eq(siteRecords.id, id), inProject(db, siteRecords.projectId, scope)))
    .limit(1);
  return row;
}

export async function insertSiteRecord(db: Executor, scope: ProjectScope, createdBy: string, values: SiteRecordValues): Promise<string> {
  const [row] = await db
    .insert(siteRecords)
    .values({ ...values, projectId: scope.projectId, createdBy })
    .returning({ id: siteRecords.id });
  return row.id;
}

/** Stores a new analysis at `version` (then +1), or at any version when `version` is null. */
export async function updateAnalysisAtVersion(
  db: Executor,
  scope: ProjectScope,
  id: string,
  version: number | null,
  analysis: SiteRecordRow['analysis'],
): Promise<boolean> {
  const rows = await db
    .update(siteRecords)
    .set({ analysis, version: sql`${siteRecords.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(siteRecords.id, id), version === null ? undefined : eq(siteRecords.version, version), inProject(db, siteRecords.projectId, scope)))
    .returning({ id: siteRecords.id });
  return rows.length > 0;
}

export async function deleteSiteRecord(db: Executor, scope: ProjectScope, id: string): Promise<boolean> {
  const rows = await db
    .delete(siteRecords)
    .where(and(eq(siteRecords.id, id), inProject(db, siteRecords.projectId, scope)))
    .returning({ id: siteRecords.id });
  return rows.length > 0;
}

/** The without-damper records of a mode, newest first (the comparison takes the first with a damping ratio). */
export async function findWithoutDamperRecords(db: Executor, scope: ProjectScope, modeId: string): Promise<{ id: string; analysis: SiteRecordRow['analysis'] }[]> {
  return db
    .select({ id: siteRecords.id, analysis: siteRecords.analysis })
    .from(siteRecords)
    .where(and(eq(siteRecords.modeId, modeId), eq(siteRecords.condition, 'without-damper'), inProject(db, siteRecords.projectId, scope)))
    .orderBy(desc(siteRecords.createdAt));
}
