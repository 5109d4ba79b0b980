import type { Database } from '../../db/client';
import { invalidField, notFound } from '../../lib/http-error';
import type { CurrentUser } from '../../middleware/auth';
import type { ProjectMember } from '../../../shared/contracts/members';
import { findMember } from '../members/members.repository';
import { requireProject } from '../projects/projects.service';
import * as repository from './project-members.repository';
import { pageOffset, type PageQuery, type Paging } from '../../../shared/contracts/paging';
import { paged } from '../../lib/paging';

function toProjectMember(row: repository.ProjectMemberRow): ProjectMember {
  return { userId: row.userId, email: row.email, name: row.name ?? row.email, role: row.role, addedAt: row.addedAt.toISOString() };
}

export async function listProjectMembers(db: Database, user: CurrentUser, projectId: string, query: PageQuery): Promise<{ members: ProjectMember[]; paging: Paging }> {
  await requireProject(db, user, projectId);
  const rows = await repository.listProjectMembers(db, user.organisationId, projectId, { offset: pageOffset(query), limit: query.pageSize + 1 });
  const { items, paging } = paged(rows, query);
  return { members: items.map(toProjectMember), paging };
}

/** Adds a person of the same organisation to the project; returns the member and whether they were new. */
export async function addProjectMember(
  db: Database,
  user: CurrentUser,
  projectId: string,
  userId: string,
): Promise<{ member: ProjectMember; created: boolean }> {
  await requireProject(db, user, projectId);
  if (!(await findMember(db, user.organisationId, userId))) {
    throw invalidField('userId', 'is not a member of your organisation');
  }
  const created = await repository.addProjectMember(db, projectId, userId);
  const member = await repository.findProjectMember(db, user.organisationId, projectId, userId);
  if (!member) throw notFound('The project member');
  return { member: toProjectMember(member), created };
}

export async function removeProjectMember(db: Database, user: CurrentUser, projectId: string, userId: string): Promise<void> {
  await requireProject(db, user, projectId);
  if (!(await repository.removeProjectMember(db, projectId, userId))) throw notFound('That person on this project', 'project_member_not_found');
}
