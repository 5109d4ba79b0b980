/**
 * Sign-in and sign-out through the real Auth.js endpoints (csrf → callback/credentials → session cookie →
 * signout), GET /api/me, and a role change taking effect without signing in again.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { meSchema } from '../../shared/contracts/me';
import { attemptSignIn, createTestApp, signIn, testPassword, type TestApp } from '../support/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  await t?.close();
});

describe('sign-in', () => {
  it('signs in with e-mail and password; the session names the user, organisation and role', async () => {
    const agent = await signIn(t.app, t.people.engineer.email);
    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toMatchObject({ email: 'engineer@a.test', id: t.people.engineer.id, role: 'engineer', organisationId: t.organisationA });
    const me = meSchema.parse((await agent.get('/api/me').expect(200)).body);
    expect(me).toEqual({
      id: t.people.engineer.id,
      email: 'engineer@a.test',
      name: 'A engineer',
      role: 'engineer',
      organisation: { id: t.organisationA, name: 'Test organisation A' },
    });
  });

  it('the e-mail is matched without regard to case or surrounding spaces', async () => {
    const agent = await signIn(t.app, '  Viewer@A.test ');
    expect((await agent.get('/api/me').expect(200)).body.role).toBe('viewer');
  });

  it('a wrong password or an unknown e-mail gets no session', async () => {
    for (const [email, password] of [
      [t.people.engineer.email, 'not-the-password'],
      ['nobody@a.test', testPassword],
    ]) {
      const { agent, response } = await attemptSignIn(t.app, email, password);
      expect(response.status).toBe(302);
      expect(response.headers.location).toContain('error=CredentialsSignin');
      await agent.get('/api/me').expect(401);
    }
  });

  it('a sign-in without the CSRF token is refused', async () => {
    const agent = request.agent(t.app);
    const response = await agent.post('/api/auth/callback/credentials').type('form').send({ email: t.people.engineer.email, password: testPassword });
    expect(response.headers.location ?? '').toContain('error=MissingCSRF');
    await agent.get('/api/me').expect(401);
  });

  it('X-Auth-Return-Redirect gives the SPA a JSON answer instead of a redirect', async () => {
    const { agent, response } = await attemptSignIn(t.app, t.people.owner.email, testPassword, { 'X-Auth-Return-Redirect': '1' });
    expect(response.status).toBe(200);
    expect(typeof response.body.url).toBe('string');
    expect((await agent.get('/api/me').expect(200)).body.role).toBe('owner');
  });

  it('a sign-in posted from another site gets 403', async () => {
    const { agent, response } = await attemptSignIn(t.app, t.people.owner.email, testPassword, { Origin: 'https://elsewhere.example' });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('cross_origin');
    await agent.get('/api/me').expect(401);
  });
});

describe('sign-out', () => {
  it('ends the session', async () => {
    const agent = await signIn(t.app, t.people.fabricator.email);
    await agent.get('/api/me').expect(200);
    const { csrfToken } = (await agent.get('/api/auth/csrf').expect(200)).body as { csrfToken: string };
    const response = await agent.post('/api/auth/signout').type('form').send({ csrfToken });
    expect(response.status).toBe(302);
    await agent.get('/api/me').expect(401);
    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body).toBeNull();
  });
});

describe('roles are read on every request', () => {
  it('a role changed by an admin ends the person’s sessions; signed in again, the new role applies', async () => {
    const admin = await signIn(t.app, t.people.admin.email);
    const before = await signIn(t.app, t.people.owner.email);
    await before.post('/api/projects').send({ name: 'Before promotion', kind: 'floor' }).expect(403);
    await admin.patch(`/api/organisation/members/${t.people.owner.id}`).send({ role: 'engineer' }).expect(200);
    // The session from before the change has ended (docs/decisions/0017-session-generation.md).
    expect((await before.get('/api/me').expect(401)).body.error.code).toBe('session_ended');
    const promoted = await signIn(t.app, t.people.owner.email);
    expect((await promoted.get('/api/me').expect(200)).body.role).toBe('engineer');
    await promoted.post('/api/projects').send({ name: 'After promotion', kind: 'floor' }).expect(201);
    await admin.patch(`/api/organisation/members/${t.people.owner.id}`).send({ role: 'owner' }).expect(200);
    await promoted.post('/api/projects').send({ name: 'After demotion', kind: 'floor' }).expect(401);
    const demoted = await signIn(t.app, t.people.owner.email);
    await demoted.post('/api/projects').send({ name: 'After demotion', kind: 'floor' }).expect(403);
    // The admin who made the changes is still signed in.
    await admin.get('/api/me').expect(200);
  });
});

describe('changing one’s password', () => {
  it('needs the current password; afterwards only the new one signs in', async () => {
    const agent = await signIn(t.app, t.people.fabricator.email);
    const wrong = await agent.put('/api/me/password').send({ currentPassword: 'not-it', newPassword: 'a-brand-new-password' }).expect(400);
    expect(wrong.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['currentPassword']);
    const short = await agent.put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'short' }).expect(400);
    expect(short.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['newPassword']);
    await request(t.app).put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'a-brand-new-password' }).expect(401);
    await agent.put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'a-brand-new-password' }).expect(204);
    await signIn(t.app, t.people.fabricator.email, 'a-brand-new-password');
    const { response } = await attemptSignIn(t.app, t.people.fabricator.email, testPassword);
    expect(response.headers.location).toContain('error=CredentialsSignin');
    await agent.put('/api/me/password').send({ currentPassword: 'a-brand-new-password', newPassword: testPassword }).expect(204);
  });
});

describe('password guessing', () => {
  it('after ten failed sign-ins for an address, even the right password gets 429 until the window passes', async () => {
    const email = t.people.admin.email;
    for (let i = 0; i < 10; i += 1) {
      const { response } = await attemptSignIn(t.app, email, `wrong-${i}`);
      expect(response.headers.location).toContain('error=CredentialsSignin');
    }
    const { agent, response: refused } = await attemptSignIn(t.app, ' ADMIN@a.test', testPassword);
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_sign_in_attempts');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    await agent.get('/api/me').expect(401);
    // Other people are not affected.
    await signIn(t.app, t.people.engineer.email);
  });
});

describe('the signed-in person is read once per request', () => {
  /** How many times the app takes a connection from its pool (once per query) while `run` runs. */
  async function poolCheckouts(run: () => Promise<unknown>): Promise<number> {
    let checkouts = 0;
    const count = () => {
      checkouts += 1;
    };
    t.ctx.pool.on('acquire', count);
    try {
      await run();
    } finally {
      t.ctx.pool.off('acquire', count);
    }
    return checkouts;
  }

  it('one query for GET /api/me, and still one when a request falls through every signed-in router to the API 404', async () => {
    const agent = await signIn(t.app, t.people.viewer.email);
    expect(await poolCheckouts(() => agent.get('/api/me').expect(200))).toBe(1);
    const id = '00000000-0000-4000-8000-000000000000';
    const fallThrough = await poolCheckouts(async () => {
      const response = await agent.get(`/api/projects/${id}/members/${id}`).expect(404);
      expect(response.body.error.code).toBe('not_found');
    });
    expect(fallThrough).toBe(1);
  });
});
