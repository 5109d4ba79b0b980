/**
 * /api/projects against a real PostgreSQL: who may do what (role × route), organisation scoping, optimistic
 * concurrency, bad input and the same-origin rule.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { projectMembers, projects } from '../../server/db/schema';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { projectListSchema, projectSchema, type Project } from '../../shared/contracts/projects';
import { roles, type Role } from '../../shared/contracts/roles';
import { appUrl, createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;
let sharedProject: Project;

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
  const created = await agents.engineer.post('/api/projects').send({ name: 'Shared test footbridge', kind: 'footbridge', location: 'Test site' }).expect(201);
  sharedProject = projectSchema.parse(created.body);
});

afterAll(async () => {
  await t?.close();
});

function expectError(body: unknown, code: string) {
  const parsed = apiErrorSchema.parse(body);
  expect(parsed.error.code).toBe(code);
  return parsed.error;
}

describe('without a session', () => {
  it.each([
    ['get', '/api/projects'],
    ['post', '/api/projects'],
    ['get', '/api/projects/00000000-0000-4000-8000-000000000000'],
    ['patch', '/api/projects/00000000-0000-4000-8000-000000000000'],
    ['delete', '/api/projects/00000000-0000-4000-8000-000000000000'],
    ['get', '/api/projects/00000000-0000-4000-8000-000000000000/members'],
    ['get', '/api/me'],
    ['get', '/api/organisation/members'],
  ] as const)('%s %s → 401', async (method, path) => {
    const response = await request(t.app)[method](path).send(method === 'get' || method === 'delete' ? undefined : { name: 'x', kind: 'floor', version: 1 });
    expect(response.status).toBe(401);
    expectError(response.body, 'unauthenticated');
  });

  it('a forged session cookie is not a session', async () => {
    const response = await request(t.app).get('/api/projects').set('Cookie', 'authjs.session-token=forged.value.here');
    expect(response.status).toBe(401);
  });
});

describe('role × route', () => {
  const writers: Role[] = ['admin', 'engineer'];
  const readers: Role[] = ['owner', 'fabricator', 'viewer'];

  it.each(roles)('%s lists the organisation’s projects (200), never another organisation’s', async (role) => {
    const response = await agents[role].get('/api/projects').expect(200);
    const list = projectListSchema.parse(response.body);
    expect(list.projects.map((p) => p.id)).toContain(sharedProject.id);
    expect(list.projects.map((p) => p.id)).not.toContain(t.outsiderProjectId);
    expect(list.projects.every((p) => p.organisationId === t.organisationA)).toBe(true);
  });

  it.each(roles)('%s reads a project of the organisation (200)', async (role) => {
    const response = await agents[role].get(`/api/projects/${sharedProject.id}`).expect(200);
    expect(projectSchema.parse(response.body).name).toBe('Shared test footbridge');
  });

  it.each(roles)('%s gets 404 for another organisation’s project (read, change, delete, members)', async (role) => {
    const id = t.outsiderProjectId;
    expectError((await agents[role].get(`/api/projects/${id}`).expect(404)).body, 'project_not_found');
    expectError((await agents[role].get(`/api/projects/${id}/members`).expect(404)).body, 'project_not_found');
    if (writers.includes(role)) {
      expectError((await agents[role].patch(`/api/projects/${id}`).send({ version: 1, name: 'Taken over' }).expect(404)).body, 'project_not_found');
      expectError((await agents[role].delete(`/api/projects/${id}`).expect(404)).body, 'project_not_found');
    }
    const [row] = await t.ctx.db.select().from(projects).where(eq(projects.id, id));
    expect(row.name).toBe('B private footbridge');
  });

  it.each(writers)('%s creates a project (201 with the project, creator on its team)', async (role) => {
    const response = await agents[role].post('/api/projects').send({ name: `  ${role} floor bay  `, kind: 'floor' }).expect(201);
    const project = projectSchema.parse(response.body);
    expect(project).toMatchObject({ name: `${role} floor bay`, kind: 'floor', location: null, description: null, version: 1, organisationId: t.organisationA });
    expect(response.headers.location).toBe(`/api/projects/${project.id}`);
    const team = await t.ctx.db.select().from(projectMembers).where(eq(projectMembers.projectId, project.id));
    expect(team.map((m) => m.userId)).toEqual([t.people[role].id]);
  });

  it.each(readers)('%s may not create, change or delete projects (403) and nothing changes', async (role) => {
    const before = await t.ctx.db.select().from(projects);
    expectError((await agents[role].post('/api/projects').send({ name: 'Not allowed', kind: 'floor' }).expect(403)).body, 'forbidden');
    expectError((await agents[role].patch(`/api/projects/${sharedProject.id}`).send({ version: sharedProject.version, name: 'Nope' }).expect(403)).body, 'forbidden');
    expectError((await agents[role].delete(`/api/projects/${sharedProject.id}`).expect(403)).body, 'forbidden');
    expect(await t.ctx.db.select().from(projects)).toEqual(before);
  });

  it('the fabricator gets 403 on create', async () => {
    const response = await agents.fabricator.post('/api/projects').send({ name: 'Hardware-only project', kind: 'footbridge' });
    expect(response.status).toBe(403);
  });

  it('an engineer of another organisation sees only their own project', async () => {
    const list = projectListSchema.parse((await outsiderAgent.get('/api/projects').expect(200)).body);
    expect(list.projects.map((p) => p.id)).toEqual([t.outsiderProjectId]);
    await outsiderAgent.get(`/api/projects/${sharedProject.id}`).expect(404);
  });
});

describe('changing a project', () => {
  it('PATCH with the current version changes it and increments the version', async () => {
    const created = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Versioned', kind: 'footbridge' }).expect(201)).body);
    const response = await agents.engineer.patch(`/api/projects/${created.id}`).send({ version: 1, location: 'Riverside', description: 'Two spans' }).expect(200);
    const updated = projectSchema.parse(response.body);
    expect(updated).toMatchObject({ name: 'Versioned', location: 'Riverside', description: 'Two spans', version: 2 });
    expect(Date.parse(updated.updatedAt)).toBeGreaterThanOrEqual(Date.parse(created.updatedAt));
    const cleared = projectSchema.parse((await agents.admin.patch(`/api/projects/${created.id}`).send({ version: 2, location: null }).expect(200)).body);
    expect(cleared).toMatchObject({ location: null, version: 3 });
  });

  it('PATCH with a stale version gets 409 and changes nothing', async () => {
    const created = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Contended', kind: 'floor' }).expect(201)).body);
    await agents.engineer.patch(`/api/projects/${created.id}`).send({ version: 1, name: 'First writer' }).expect(200);
    const [before] = await t.ctx.db.select().from(projects).where(eq(projects.id, created.id));
    const response = await agents.admin.patch(`/api/projects/${created.id}`).send({ version: 1, name: 'Second writer' });
    expect(response.status).toBe(409);
    const error = expectError(response.body, 'version_conflict');
    expect(error.issues[0].path).toBe('version');
    const [after] = await t.ctx.db.select().from(projects).where(eq(projects.id, created.id));
    expect(after).toEqual(before);
    expect(after).toMatchObject({ name: 'First writer', version: 2 });
  });

  it('of two simultaneous changes at the same version exactly one wins; the other gets 409', async () => {
    const created = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Race', kind: 'floor' }).expect(201)).body);
    const attempts = await Promise.all(
      ['Writer A', 'Writer B', 'Writer C', 'Writer D'].map((name, i) =>
        (i % 2 === 0 ? agents.engineer : agents.admin).patch(`/api/projects/${created.id}`).send({ version: 1, name }),
      ),
    );
    const statuses = attempts.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409, 409]);
    const winner = attempts.find((r) => r.status === 200)!.body as Project;
    const [row] = await t.ctx.db.select().from(projects).where(eq(projects.id, created.id));
    expect(row).toMatchObject({ name: winner.name, version: 2 });
  });

  it('DELETE removes the project (204) and then it is gone (404)', async () => {
    const created = projectSchema.parse((await agents.admin.post('/api/projects').send({ name: 'Short-lived', kind: 'floor' }).expect(201)).body);
    await agents.engineer.delete(`/api/projects/${created.id}`).expect(204);
    await agents.engineer.get(`/api/projects/${created.id}`).expect(404);
  });
});

describe('bad input', () => {
  it('an empty name gets 400 naming `name`, and nothing is stored', async () => {
    const before = (await t.ctx.db.select().from(projects)).length;
    const response = await agents.engineer.post('/api/projects').send({ name: '   ', kind: 'footbridge' });
    expect(response.status).toBe(400);
    const error = expectError(response.body, 'invalid_request');
    expect(error.issues.map((i) => i.path)).toEqual(['name']);
    expect(error.message).toContain('name');
    expect((await t.ctx.db.select().from(projects)).length).toBe(before);
  });

  it('an unknown kind names `kind`; several bad fields are all named', async () => {
    const one = expectError((await agents.engineer.post('/api/projects').send({ name: 'X', kind: 'tower' }).expect(400)).body, 'invalid_request');
    expect(one.issues.map((i) => i.path)).toEqual(['kind']);
    const many = expectError((await agents.engineer.post('/api/projects').send({ location: 5 }).expect(400)).body, 'invalid_request');
    expect(many.issues.map((i) => i.path).sort()).toEqual(['kind', 'location', 'name']);
  });

  it('PATCH without a version names `version`; an empty change is refused', async () => {
    const missing = expectError((await agents.engineer.patch(`/api/projects/${sharedProject.id}`).send({ name: 'No version' }).expect(400)).body, 'invalid_request');
    expect(missing.issues.map((i) => i.path)).toEqual(['version']);
    await agents.engineer.patch(`/api/projects/${sharedProject.id}`).send({ version: sharedProject.version }).expect(400);
    const [row] = await t.ctx.db.select().from(projects).where(eq(projects.id, sharedProject.id));
    expect(row.name).toBe('Shared test footbridge');
  });

  it('a malformed project id names `id`', async () => {
    const error = expectError((await agents.viewer.get('/api/projects/not-a-uuid').expect(400)).body, 'invalid_request');
    expect(error.issues.map((i) => i.path)).toEqual(['id']);
  });

  it('invalid JSON gets 400, not 500', async () => {
    const response = await agents.engineer.post('/api/projects').set('Content-Type', 'application/json').send('{"name": "broken",');
    expect(response.status).toBe(400);
    expectError(response.body, 'invalid_json');
  });

  it('a body over the size limit gets 413, not 500', async () => {
    const response = await agents.engineer.post('/api/projects').send({ name: 'Huge', kind: 'floor', description: 'x'.repeat(6 * 1024 * 1024) });
    expect(response.status).toBe(413);
    expectError(response.body, 'payload_too_large');
  });

  it('a body that is not JSON gets 415', async () => {
    const response = await agents.engineer.post('/api/projects').set('Content-Type', 'text/plain').send('name=x');
    expect(response.status).toBe(415);
    expectError(response.body, 'unsupported_media_type');
  });
});

describe('same-origin rule', () => {
  it('a POST whose Origin names another site gets 403 and stores nothing', async () => {
    const before = (await t.ctx.db.select().from(projects)).length;
    const response = await agents.engineer.post('/api/projects').set('Origin', 'https://elsewhere.example').send({ name: 'Cross-site', kind: 'floor' });
    expect(response.status).toBe(403);
    expectError(response.body, 'cross_origin');
    expect((await t.ctx.db.select().from(projects)).length).toBe(before);
  });

  it('a POST from the app’s own origin, or without Origin, is allowed', async () => {
    await agents.engineer.post('/api/projects').set('Origin', appUrl).send({ name: 'Same-site', kind: 'floor' }).expect(201);
    await agents.engineer.post('/api/projects').send({ name: 'No origin header', kind: 'floor' }).expect(201);
  });

  it('reads from another origin are not blocked by the rule (the session cookie is what protects them)', async () => {
    await agents.viewer.get('/api/projects').set('Origin', 'https://elsewhere.example').expect(200);
  });
});

describe('project members', () => {
  it('everyone reads the team; admins and engineers add and remove people of their organisation', async () => {
    const path = `/api/projects/${sharedProject.id}/members`;
    const initial = await agents.viewer.get(path).expect(200);
    expect((initial.body as { members: { userId: string }[] }).members.map((m) => m.userId)).toEqual([t.people.engineer.id]);
    const added = await agents.engineer.post(path).send({ userId: t.people.fabricator.id }).expect(201);
    expect(added.body).toMatchObject({ userId: t.people.fabricator.id, role: 'fabricator', email: 'fabricator@a.test' });
    await agents.engineer.post(path).send({ userId: t.people.fabricator.id }).expect(200);
    await agents.owner.post(path).send({ userId: t.people.viewer.id }).expect(403);
    const foreign = expectError((await agents.engineer.post(path).send({ userId: t.outsider.id }).expect(400)).body, 'invalid_request');
    expect(foreign.issues.map((i) => i.path)).toEqual(['userId']);
    await agents.viewer.delete(`${path}/${t.people.fabricator.id}`).expect(403);
    await agents.admin.delete(`${path}/${t.people.fabricator.id}`).expect(204);
    await agents.admin.delete(`${path}/${t.people.fabricator.id}`).expect(404);
  });
});
