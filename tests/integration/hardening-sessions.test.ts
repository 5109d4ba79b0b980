/**
 * Sessions end when they should: a session cookie kept from before a sign-out, a password change, a role change or
 * a removal no longer works, on every device. The device that changed its password stays signed in.
 */
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../server/db/schema';
import { createTestApp, signIn, testPassword, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  await t?.close();
});

/** The session cookie an agent holds, as a header to replay from elsewhere. */
async function sessionCookie(agent: Agent): Promise<string> {
  const response = await agent.get('/api/auth/session').expect(200);
  expect(response.body?.user).toBeTruthy();
  // supertest's agent keeps its cookies in a jar; read the one it sends.
  const jar = (agent as unknown as { jar: { getCookies(access: unknown): { name: string; value: string }[] } }).jar;
  const cookie = jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).find((c) => c.name === 'authjs.session-token');
  expect(cookie).toBeDefined();
  return `authjs.session-token=${cookie!.value}`;
}

async function signOut(agent: Agent): Promise<void> {
  const { csrfToken } = (await agent.get('/api/auth/csrf').expect(200)).body as { csrfToken: string };
  await agent.post('/api/auth/signout').type('form').send({ csrfToken }).expect(302);
}

describe('a kept session cookie', () => {
  it('stops working after its owner signs out (on this device and on every other)', async () => {
    const agent = await signIn(t.app, t.people.viewer.email);
    const otherDevice = await signIn(t.app, t.people.viewer.email);
    const kept = await sessionCookie(agent);
    await request(t.app).get('/api/me').set('Cookie', kept).expect(200);
    await signOut(agent);
    const replayed = await request(t.app).get('/api/me').set('Cookie', kept);
    expect(replayed.status).toBe(401);
    expect(replayed.body.error.code).toBe('session_ended');
    await otherDevice.get('/api/me').expect(401);
    // Signing in again works.
    await (await signIn(t.app, t.people.viewer.email)).get('/api/me').expect(200);
  });

  it('stops working after a password change, except on the device that changed it', async () => {
    const changer = await signIn(t.app, t.people.fabricator.email);
    const elsewhere = await signIn(t.app, t.people.fabricator.email);
    const kept = await sessionCookie(elsewhere);
    await changer.put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'another-long-password' }).expect(204);
    await changer.get('/api/me').expect(200);
    await elsewhere.get('/api/me').expect(401);
    await request(t.app).get('/api/me').set('Cookie', kept).expect(401);
    await changer.put('/api/me/password').send({ currentPassword: 'another-long-password', newPassword: testPassword }).expect(204);
    await changer.get('/api/me').expect(200);
  });

  it('stops working after an admin changes the person’s role, or removes them', async () => {
    const admin = await signIn(t.app, t.people.admin.email);
    const person = await signIn(t.app, t.people.owner.email);
    const kept = await sessionCookie(person);
    await admin.patch(`/api/organisation/members/${t.people.owner.id}`).send({ role: 'viewer' }).expect(200);
    await request(t.app).get('/api/me').set('Cookie', kept).expect(401);
    await request(t.app).get('/api/projects').set('Cookie', kept).expect(401);
    // Setting the role it already has ends nothing.
    const again = await signIn(t.app, t.people.owner.email);
    await admin.patch(`/api/organisation/members/${t.people.owner.id}`).send({ role: 'viewer' }).expect(200);
    await again.get('/api/me').expect(200);
    const keptAgain = await sessionCookie(again);
    await admin.delete(`/api/organisation/members/${t.people.owner.id}`).expect(204);
    await request(t.app).get('/api/me').set('Cookie', keptAgain).expect(401);
  });

  it('a forged or tampered cookie is 401', async () => {
    const agent = await signIn(t.app, t.people.engineer.email);
    const kept = await sessionCookie(agent);
    await request(t.app).get('/api/me').set('Cookie', `${kept.slice(0, -4)}AAAA`).expect(401);
    await request(t.app).get('/api/me').set('Cookie', 'authjs.session-token=not-a-token').expect(401);
  });
});

describe('password hashes of earlier versions', () => {
  it('a bcrypt hash still signs in and is replaced by an scrypt hash', async () => {
    const bcrypt = (await import('bcryptjs')).default;
    await t.ctx.db.update(users).set({ passwordHash: await bcrypt.hash(testPassword, 4) }).where(eq(users.id, t.people.engineer.id));
    await signIn(t.app, t.people.engineer.email);
    const [row] = await t.ctx.db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, t.people.engineer.id));
    expect(row.passwordHash).toMatch(/^scrypt\$15\$8\$1\$/);
    await signIn(t.app, t.people.engineer.email);
  });
});
