/**
 * Odd input is a 4xx naming the field and the rule, never a 500: NUL characters, a version beyond the database's
 * integer, broken %-encoding in the path, an over-long e-mail address, unknown fields, a charset other than UTF-8,
 * bodies over the route's limit. And every list that can grow is paged.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultPageSize, maxPageSize, pagingSchema } from '../../shared/contracts/paging';
import { projectListSchema } from '../../shared/contracts/projects';
import { memberListSchema, peopleListSchema, projectMemberListSchema } from '../../shared/contracts/members';
import { projects } from '../../server/db/schema';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;
let admin: Agent;
let projectId: string;

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signIn(t.app, t.people.engineer.email);
  admin = await signIn(t.app, t.people.admin.email);
  projectId = (await engineer.post('/api/projects').send({ name: 'Input checks', kind: 'floor' }).expect(201)).body.id;
});

afterAll(async () => {
  await t?.close();
});

function issuePaths(body: { error: { issues: { path: string }[] } }): string[] {
  return body.error.issues.map((issue) => issue.path);
}

describe('text with a NUL character', () => {
  it.each(['name', 'description', 'location'])('is 400 naming %s, on create and on change', async (field) => {
    const create = await engineer.post('/api/projects').send({ name: 'Fine', kind: 'floor', [field]: 'bad\u0000text' });
    expect(create.status).toBe(400);
    expect(issuePaths(create.body)).toEqual([field]);
    expect(create.body.error.issues[0].message).toMatch(/NUL/);
    const change = await engineer.patch(`/api/projects/${projectId}`).send({ version: 1, [field]: '\u0000' });
    expect(change.status).toBe(400);
    expect(issuePaths(change.body)).toEqual([field]);
  });

  it('in an invitation name is 400 naming name', async () => {
    const response = await admin.post('/api/organisation/invitations').send({ email: 'nul@a.test', name: 'A\u0000B', role: 'viewer' });
    expect(response.status).toBe(400);
    expect(issuePaths(response.body)).toEqual(['name']);
  });
});

describe('version beyond the database integer', () => {
  it('is 400 naming version, and nothing changes', async () => {
    for (const version of [2_147_483_648, 1e300, 2 ** 53]) {
      const response = await engineer.patch(`/api/projects/${projectId}`).send({ version, name: 'Overflow' });
      expect(response.status, String(version)).toBe(400);
      expect([...new Set(issuePaths(response.body))]).toEqual(['version']);
    }
    expect((await engineer.get(`/api/projects/${projectId}`).expect(200)).body.name).toBe('Input checks');
  });
});

describe('broken %-encoding in the path', () => {
  it.each(['/api/projects/%ZZ', '/api/projects/%', '/api/projects/%E0%A4%A', `/api/projects/%E0%A4%A/members`])('%s is 400 invalid_path', async (path) => {
    const response = await engineer.get(path);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_path');
    expect(issuePaths(response.body)).toEqual(['path']);
  });
});

describe('e-mail addresses in invitations', () => {
  it('a 10,007-character address is 400 naming email (254 at most, RFC 5321), and no mail is sent', async () => {
    const before = t.ctx.fakeSmtp!.mails().length;
    const response = await admin.post('/api/organisation/invitations').send({ email: `${'x'.repeat(10_000)}@a.test`, role: 'viewer' });
    expect(response.status).toBe(400);
    expect(issuePaths(response.body)).toEqual(['email']);
    expect(response.body.error.issues[0].message).toMatch(/at most 254/);
    expect(t.ctx.fakeSmtp!.mails().length).toBe(before);
  });
});

describe('unknown fields', () => {
  it('are refused by name in project requests, even a large junk field', async () => {
    const create = await engineer.post('/api/projects').send({ name: 'Junk', kind: 'floor', junk: 'x'.repeat(60_000) });
    expect(create.status).toBe(400);
    expect(issuePaths(create.body)).toEqual(['junk']);
    const change = await engineer.patch(`/api/projects/${projectId}`).send({ version: 1, nmae: 'typo' });
    expect(change.status).toBe(400);
    expect(issuePaths(change.body)).toEqual(['nmae']);
  });

  it('are refused in member, invitation and password requests', async () => {
    const invite = await admin.post('/api/organisation/invitations').send({ email: 'extra@a.test', role: 'viewer', admin: true });
    expect(issuePaths(invite.body)).toEqual(['admin']);
    const role = await admin.patch(`/api/organisation/members/${t.people.viewer.id}`).send({ role: 'viewer', organisationId: t.organisationB });
    expect(issuePaths(role.body)).toEqual(['organisationId']);
    const password = await engineer.put('/api/me/password').send({ currentPassword: 'x', newPassword: 'long-enough-password', userId: t.people.admin.id });
    expect(issuePaths(password.body)).toEqual(['userId']);
  });
});

describe('body size and charset', () => {
  it('a project body over 64 kB is 413 payload_too_large (the 4.9 MB junk field no longer gets in)', async () => {
    const response = await engineer.post('/api/projects').set('Content-Type', 'application/json').send(JSON.stringify({ name: 'Big', kind: 'floor', junk: 'x'.repeat(4_900_000) }));
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });

  it('a JSON body declared as UTF-16 is 415 unsupported_charset', async () => {
    const body = Buffer.from(JSON.stringify({ name: 'Wide', kind: 'floor' }), 'utf16le');
    const response = await engineer.post('/api/projects').set('Content-Type', 'application/json; charset=utf-16').send(body);
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('unsupported_charset');
    const latin = await engineer.post('/api/projects').set('Content-Type', 'application/json; charset=iso-8859-1').send('{"name":"L","kind":"floor"}');
    expect(latin.status).toBe(415);
    // UTF-8 stated explicitly is fine.
    await engineer.post('/api/projects').set('Content-Type', 'application/json; charset=UTF-8').send('{"name":"Narrow","kind":"floor"}').expect(201);
  });
});

describe('paging', () => {
  it('GET /api/projects pages with a default of 50 and a maximum of 200; the list field stays', async () => {
    // 260 projects more for organisation A (inserted directly: the API is not what is measured here).
    await t.ctx.db.insert(projects).values(Array.from({ length: 260 }, (_, i) => ({ organisationId: t.organisationA, name: `Paged ${String(i).padStart(3, '0')}`, kind: 'floor' as const })));
    const first = projectListSchema.parse((await engineer.get('/api/projects').expect(200)).body);
    expect(first.projects).toHaveLength(defaultPageSize);
    expect(first.paging).toEqual({ page: 1, pageSize: defaultPageSize, hasMore: true });
    const ids = new Set<string>();
    let page = 1;
    for (;;) {
      const body = projectListSchema.parse((await engineer.get(`/api/projects?page=${page}&pageSize=${maxPageSize}`).expect(200)).body);
      for (const project of body.projects) ids.add(project.id);
      if (!body.paging.hasMore) break;
      page += 1;
    }
    expect(page).toBe(2);
    // 260 + the ones this file created before.
    expect(ids.size).toBeGreaterThan(260);
    const tooBig = await engineer.get(`/api/projects?pageSize=${maxPageSize + 1}`);
    expect(tooBig.status).toBe(400);
    expect(issuePaths(tooBig.body)).toEqual(['pageSize']);
    for (const bad of ['page=0', 'page=abc', 'pageSize=1.5', 'page=1e400']) {
      const response = await engineer.get(`/api/projects?${bad}`);
      expect(response.status, bad).toBe(400);
      expect(issuePaths(response.body), bad).toEqual([bad.split('=')[0]]);
    }
  });

  it('members, invitations, people and a project’s members are paged too', async () => {
    const members = memberListSchema.parse((await admin.get('/api/organisation/members?pageSize=2').expect(200)).body);
    expect(members.members).toHaveLength(2);
    expect(members.paging).toEqual({ page: 1, pageSize: 2, hasMore: true });
    const people = peopleListSchema.parse((await engineer.get('/api/organisation/people?page=3&pageSize=2').expect(200)).body);
    expect(people.people).toHaveLength(1);
    expect(people.paging.hasMore).toBe(false);
    const team = projectMemberListSchema.parse((await engineer.get(`/api/projects/${projectId}/members`).expect(200)).body);
    expect(team.members.map((m) => m.userId)).toEqual([t.people.engineer.id]);
    expect(pagingSchema.parse(team.paging)).toEqual({ page: 1, pageSize: defaultPageSize, hasMore: false });
  });
});
