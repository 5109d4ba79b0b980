import { and, desc, eq, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { projectMembers, projects, tuningVariants } from '../../db/schema';

export type ProjectRow = typeof projects.$inferSelect;
type ProjectChanges = Partial<Pick<ProjectRow, 'name' | 'kind' | 'location' | 'description'>>;

/** One page of the organisation's projects, most recently changed first; `limit` rows from `offset`. */
export function listProjects(db: Database, organisationId: string, page: { offset: number; limit: number }): Promise<ProjectRow[]> {
  let statement = listStatements.get(db);
  if (!statement) {
    statement = prepareList(db);
    listStatements.set(db, statement);
  }
  return statement.execute({ organisationId, limit: page.limit, offset: page.offset });
}

/** Prepared once per database handle: the project list is the most frequent read. */
const listStatements = new WeakMap<Database, ReturnType<typeof prepareList>>();
function prepareList(db: Database) {
  return db
    .select()
    .from(projects)
    .where(eq(projects.organisationId, sql.placeholder('organisationId')))
    .orderBy(desc(projects.updatedAt), projects.name, projects.id)
    .limit(sql.placeholder('limit'))
    .offset(sql.placeholder('offset'))
    .prepare('projects_page');
}

export async function findProject(db: Database, organisationId: string, id: string): Promise<ProjectRow | undefined> {
  const [row] = await db
    .select()
    .from(projects)
    .where(and(eq(projects.id, id), eq(projects.organisationId, organisationId)))
    .limit(1);
  return row;
}

/** Inserts the project and makes its creator its first member, in one transaction. */
export function insertProject(
  db: Database,
  values: { organisationId: string; createdBy: string; name: string; kind: ProjectRow['kind']; location?: string; description?: string },
): Promise<ProjectRow> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(projects)
      .values({ ...values, location: values.location ?? null, description: values.description ?? null })
      .returning();
    await tx.insert(projectMembers).values({ projectId: row.id, userId: values.createdBy });
    return row;
  });
}

/**
 * Changes the project only if it still has `version`; the version then goes up by one. Returns undefined when no
 * row matched (absent, another organisation's, or a stale version).
 */
export async function updateProjectAtVersion(
  db: Database,
  organisationId: string,
  id: string,
  version: number,
  changes: ProjectChanges,
): Promise<ProjectRow | undefined> {
  const [row] = await db
    .update(projects)
    .set({ ...changes, version: sql`${projects.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(projects.id, id), eq(projects.organisationId, organisationId), eq(projects.version, version)))
    .returning();
  return row;
}

/**
 * Deletes the project and everything in it. Its tuning variants go first, in the same transaction: they hold
 * no-action keys on the project's modes, load cases and criteria, which the cascade from the project would
 * otherwise check before it reached the variants.
 */
export async function deleteProject(db: Database, organisationId: string, id: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [project] = await tx
      .select({ id: projects.id })
      .from(projects)
      .where(and(eq(projects.id, id), eq(projects.organisationId, organisationId)))
      .for('update');
    if (!project) return false;
    await tx.delete(tuningVariants).where(eq(tuningVariants.projectId, id));
    const rows = await tx.delete(projects).where(eq(projects.id, id)).returning({ id: projects.id });
    return rows.length > 0;
  });
}
