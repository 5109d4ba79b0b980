import { and, asc, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { memberships, projectMembers, users } from '../../db/schema';

const columns = {
  userId: users.id,
  email: users.email,
  name: users.name,
  role: memberships.role,
  addedAt: projectMembers.addedAt,
};

export type ProjectMemberRow = { userId: string; email: string; name: string | null; role: (typeof memberships.$inferSelect)['role']; addedAt: Date };

function selectProjectMembers(db: Database, organisationId: string) {
  return db
    .select(columns)
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.organisationId, organisationId)));
}

/** One page of the project's people, in the order they were added; `limit` rows from `offset`. */
export function listProjectMembers(db: Database, organisationId: string, projectId: string, page: { offset: number; limit: number }): Promise<ProjectMemberRow[]> {
  return selectProjectMembers(db, organisationId)
    .where(eq(projectMembers.projectId, projectId))
    .orderBy(asc(projectMembers.addedAt), asc(users.email))
    .limit(page.limit)
    .offset(page.offset);
}

export async function findProjectMember(db: Database, organisationId: string, projectId: string, userId: string): Promise<ProjectMemberRow | undefined> {
  const [row] = await selectProjectMembers(db, organisationId)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
    .limit(1);
  return row;
}

/** Adds the person (nothing happens when they are already on the project). True when newly added. */
export async function addProjectMember(db: Database, projectId: string, userId: string): Promise<boolean> {
  const rows = await db.insert(projectMembers).values({ projectId, userId }).onConflictDoNothing().returning({ userId: projectMembers.userId });
  return rows.length > 0;
}

export async function removeProjectMember(db: Database, projectId: string, userId: string): Promise<boolean> {
  const rows = await db
    .delete(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
    .returning({ userId: projectMembers.userId });
  return rows.length > 0;
}
