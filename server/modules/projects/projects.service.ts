import type { Database } from '../../db/client';
import { HttpError, notFound } from '../../lib/http-error';
import type { CurrentUser } from '../../middleware/auth';
import { pageOffset, type PageQuery } from '../../../shared/contracts/paging';
import type { CreateProjectInput, Project, ProjectList, UpdateProjectInput } from '../../../shared/contracts/projects';
import { paged } from '../../lib/paging';
import * as repository from './projects.repository';
import { frozenWrite, projectHoldsApprovedDesign } from '../sign-offs/freeze';

export function toProject(row: repository.ProjectRow): Project {
  return {
    id: row.id,
    organisationId: row.organisationId,
    name: row.name,
    kind: row.kind,
    location: row.location,
    description: row.description,
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const projectNotFound = () => notFound('The project', 'project_not_found');

/**
 * The project's row if it belongs to the user's organisation; another organisation's project is reported as absent
 * (404 project_not_found), the same as one that does not exist.
 */
export async function requireProject(db: Database, user: CurrentUser, id: string): Promise<repository.ProjectRow> {
  const row = await repository.findProject(db, user.organisationId, id);
  if (!row) throw projectNotFound();
  return row;
}

export async function listProjects(db: Database, user: CurrentUser, query: PageQuery): Promise<ProjectList> {
  // One row more than the page tells whether another page follows.
  const rows = await repository.listProjects(db, user.organisationId, { offset: pageOffset(query), limit: query.pageSize + 1 });
  const { items, paging } = paged(rows, query);
  return { projects: items.map(toProject), paging };
}

export async function getProject(db: Database, user: CurrentUser, id: string): Promise<Project> {
  return toProject(await requireProject(db, user, id));
}

export async function createProject(db: Database, user: CurrentUser, input: CreateProjectInput): Promise<Project> {
  const row = await repository.insertProject(db, {
    organisationId: user.organisationId,
    createdBy: user.id,
    name: input.name,
    kind: input.kind,
    location: input.location || undefined,
    description: input.description || undefined,
  });
  return toProject(row);
}

export async function updateProject(db: Database, user: CurrentUser, id: string, input: UpdateProjectInput): Promise<Project> {
  const { version, ...fields } = input;
  const changes = Object.fromEntries(Object.entries(fields).filter(([, value]) => value !== undefined));
  // An empty optional text is stored as "not given".
  for (const key of ['location', 'description'] as const) {
    if (changes[key] === '') changes[key] = null;
  }
  if (Object.keys(changes).length === 0) {
    throw new HttpError(400, 'invalid_request', 'Give at least one of name, kind, location, description to change', [
      { path: '', message: 'give at least one of name, kind, location, description to change' },
    ]);
  }
  const row = await repository.updateProjectAtVersion(db, user.organisationId, id, version, changes);
  if (row) return toProject(row);
  const current = await requireProject(db, user, id);
  throw new HttpError(
    409,
    'version_conflict',
    `The project was changed by someone else (you sent version ${version}, it is now at version ${current.version}); reload it and apply your change again`,
    [{ path: 'version', message: `version: is ${current.version} now, not ${version}` }],
  );
}

export async function deleteProject(db: Database, user: CurrentUser, id: string): Promise<void> {
  // A project that holds a design the owner approved keeps it: the database's freeze refuses deleting its variant.
  const deleted = await frozenWrite(projectHoldsApprovedDesign(), () => repository.deleteProject(db, user.organisationId, id));
  if (!deleted) throw projectNotFound();
}
