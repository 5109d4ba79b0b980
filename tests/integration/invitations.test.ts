/**
 * The invitation flow end to end through the in-process fake SMTP server: an admin invites → the mail is caught →
 * the token comes from the link in it → preview → accept with a password → sign in → the role is the one given.
 * Also who may see and change the organisation's people.
 */
import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { invitations, users } from '../../server/db/schema';
import { devMailListSchema } from '../../shared/contracts/app-config';
import { invitationPreviewSchema, invitationSchema, memberListSchema, peopleListSchema } from '../../shared/contracts/members';
import { meSchema } from '../../shared/contracts/me';
import { roles, type Role } from '../../shared/contracts/roles';
import { appUrl, createTestApp, signIn, signInDemoAdmin, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: Agent;
/** The demo organisation's admin, who may read the development mailbox. */
let mailbox: Agent;

beforeAll(async () => {
  t = await createTestApp({ demo: true });
  admin = await signIn(t.app, t.people.admin.email);
  mailbox = await signInDemoAdmin(t.app);
});

afterAll(async () => {
  await t?.close();
});

/** The token in the newest mail to `to`, read from the development mailbox over HTTP. */
async function tokenFromMail(to: string): Promise<string> {
  const list = devMailListSchema.parse((await mailbox.get('/api/dev/mail').expect(200)).body);
  const mail = list.mails.find((m) => m.to.includes(to));
  expect(mail, `a mail to ${to}`).toBeDefined();
  const link = mail!.text.match(/https?:\/\/\S+\/invitations\/([A-Za-z0-9_-]+)/);
  expect(link, 'an invitation link in the mail').not.toBeNull();
  expect(link![0].startsWith(`${appUrl}/invitations/`)).toBe(true);
  expect(mail!.html).toContain(link![0]);
  return link![1];
}

describe('invitation flow', () => {
  it('invite → mail → accept → sign in with the new password → the role given', async () => {
    const created = await admin.post('/api/organisation/members').send({ email: '  New.Fabricator@Example.test ', role: 'fabricator' }).expect(201);
    const invitation = invitationSchema.parse(created.body);
    expect(invitation).toMatchObject({ email: 'new.fabricator@example.test', role: 'fabricator', status: 'pending' });

    const token = await tokenFromMail('new.fabricator@example.test');
    const [stored] = await t.ctx.db.select().from(invitations).where(eq(invitations.id, invitation.id));
    // Only the SHA-256 of the token is stored (docs/decisions/0005), computed here with Node's own crypto.
    expect(stored.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(stored.tokenHash).not.toContain(token);

    const preview = invitationPreviewSchema.parse((await request(t.app).get(`/api/invitations/${token}`).expect(200)).body);
    expect(preview).toEqual({ email: 'new.fabricator@example.test', role: 'fabricator', organisationName: 'Test organisation A' });

    const accepted = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Nell Fabricator', password: 'a-long-new-password' }).expect(201);
    expect(accepted.body).toMatchObject({ email: 'new.fabricator@example.test', role: 'fabricator', organisationName: 'Test organisation A' });
    expect(accepted.headers['set-cookie']).toBeUndefined();

    const person = await signIn(t.app, 'new.fabricator@example.test', 'a-long-new-password');
    const me = meSchema.parse((await person.get('/api/me').expect(200)).body);
    expect(me).toMatchObject({ name: 'Nell Fabricator', role: 'fabricator', organisation: { id: t.organisationA } });
    await person.post('/api/projects').send({ name: 'Not mine to create', kind: 'floor' }).expect(403);

    const list = memberListSchema.parse((await admin.get('/api/organisation/members').expect(200)).body);
    expect(list.members.find((m) => m.email === 'new.fabricator@example.test')?.role).toBe('fabricator');
    expect(list.invitations.find((i) => i.id === invitation.id)?.status).toBe('accepted');

    // The link works once.
    const again = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Someone else', password: 'another-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
  });

  it('POST /api/organisation/invitations does the same', async () => {
    await admin.post('/api/organisation/invitations').send({ email: 'second@example.test', role: 'viewer', name: 'Second Person' }).expect(201);
    const token = await tokenFromMail('second@example.test');
    expect((await request(t.app).get(`/api/invitations/${token}`).expect(200)).body.role).toBe('viewer');
  });

  it('a new invitation to the same address replaces the open one', async () => {
    await admin.post('/api/organisation/invitations').send({ email: 'twice@example.test', role: 'viewer' }).expect(201);
    const first = await tokenFromMail('twice@example.test');
    await admin.post('/api/organisation/invitations').send({ email: 'twice@example.test', role: 'owner' }).expect(201);
    const second = await tokenFromMail('twice@example.test');
    expect(second).not.toBe(first);
    await request(t.app).get(`/api/invitations/${first}`).expect(404);
    expect((await request(t.app).get(`/api/invitations/${second}`).expect(200)).body.role).toBe('owner');
  });

  it('an expired invitation is refused with 410', async () => {
    await admin.post('/api/organisation/invitations').send({ email: 'late@example.test', role: 'viewer' }).expect(201);
    const token = await tokenFromMail('late@example.test');
    await t.ctx.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.email, 'late@example.test'));
    expect((await request(t.app).get(`/api/invitations/${token}`).expect(410)).body.error.code).toBe('invitation_expired');
    await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Late', password: 'long-enough-password' }).expect(410);
    expect(await t.ctx.db.select().from(users).where(eq(users.email, 'late@example.test'))).toEqual([]);
  });

  it('bad input names the field; an unknown token is 404', async () => {
    const badEmail = await admin.post('/api/organisation/invitations').send({ email: 'not-an-address', role: 'viewer' }).expect(400);
    expect(badEmail.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['email']);
    const badRole = await admin.post('/api/organisation/invitations').send({ email: 'x@example.test', role: 'superuser' }).expect(400);
    expect(badRole.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['role']);
    const taken = await admin.post('/api/organisation/invitations').send({ email: t.people.viewer.email, role: 'viewer' }).expect(409);
    expect(taken.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['email']);

    await admin.post('/api/organisation/invitations').send({ email: 'short@example.test', role: 'viewer' }).expect(201);
    const token = await tokenFromMail('short@example.test');
    const short = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Short', password: 'short' }).expect(400);
    expect(short.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['password']);
    const noName = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: ' ', password: 'long-enough-password' }).expect(400);
    expect(noName.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['name']);

    expect((await request(t.app).get(`/api/invitations/${'x'.repeat(43)}`).expect(404)).body.error.code).toBe('invitation_not_found');
  });
});

describe('removing people and withdrawing invitations', () => {
  it('an admin withdraws an open invitation: its link stops working', async () => {
    const created = invitationSchema.parse(
      (await admin.post('/api/organisation/invitations').send({ email: 'withdrawn@example.test', role: 'viewer' }).expect(201)).body,
    );
    const token = await tokenFromMail('withdrawn@example.test');
    await admin.delete(`/api/organisation/invitations/${created.id}`).expect(204);
    await request(t.app).get(`/api/invitations/${token}`).expect(404);
    await admin.delete(`/api/organisation/invitations/${created.id}`).expect(404);
  });

  it('an admin removes a person: their open session stops working and the address can be invited again', async () => {
    await admin.post('/api/organisation/invitations').send({ email: 'leaver@example.test', role: 'engineer' }).expect(201);
    const token = await tokenFromMail('leaver@example.test');
    const accepted = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Leaver', password: 'leaver-password-1' }).expect(201);
    const leaver = await signIn(t.app, 'leaver@example.test', 'leaver-password-1');
    await leaver.get('/api/me').expect(200);
    await admin.delete(`/api/organisation/members/${accepted.body.userId}`).expect(204);
    await leaver.get('/api/me').expect(401);
    await leaver.post('/api/projects').send({ name: 'After leaving', kind: 'floor' }).expect(401);
    await admin.post('/api/organisation/invitations').send({ email: 'leaver@example.test', role: 'viewer' }).expect(201);
  });

  it('an admin cannot remove themselves or another organisation’s person; others cannot remove anyone', async () => {
    expect((await admin.delete(`/api/organisation/members/${t.people.admin.id}`).expect(409)).body.error.code).toBe('cannot_remove_self');
    await admin.delete(`/api/organisation/members/${t.outsider.id}`).expect(404);
    const engineer = await signIn(t.app, t.people.engineer.email);
    await engineer.delete(`/api/organisation/members/${t.people.viewer.id}`).expect(403);
    await engineer.get('/api/me').expect(200);
  });
});

describe('organisation members: admins only', () => {
  const nonAdmins: Role[] = roles.filter((role) => role !== 'admin');

  it.each(nonAdmins)('%s gets 403 on every /api/organisation route', async (role) => {
    const agent = await signIn(t.app, t.people[role].email);
    await agent.get('/api/organisation/members').expect(403);
    await agent.post('/api/organisation/members').send({ email: `from-${role}@example.test`, role: 'viewer' }).expect(403);
    await agent.post('/api/organisation/invitations').send({ email: `from-${role}@example.test`, role: 'viewer' }).expect(403);
    await agent.patch(`/api/organisation/members/${t.people.viewer.id}`).send({ role: 'admin' }).expect(403);
    expect((await agent.get('/api/me').expect(200)).body.role).toBe(role);
  });

  it.each(roles)('%s reads the organisation’s people (no invitations) through /api/organisation/people', async (role) => {
    const agent = await signIn(t.app, t.people[role].email);
    const body = peopleListSchema.parse((await agent.get('/api/organisation/people').expect(200)).body);
    expect(body.people.map((p) => p.email)).toEqual(expect.arrayContaining(roles.map((r) => `${r}@a.test`)));
    expect(body.people.map((p) => p.email)).not.toContain(t.outsider.email);
    expect(body).not.toHaveProperty('invitations');
  });

  it('the admin lists only their own organisation’s people', async () => {
    const list = memberListSchema.parse((await admin.get('/api/organisation/members').expect(200)).body);
    const emails = list.members.map((m) => m.email);
    expect(emails).toEqual(expect.arrayContaining(roles.map((role) => `${role}@a.test`)));
    expect(emails).not.toContain(t.outsider.email);
  });

  it('changing the role of another organisation’s person is 404; the last admin keeps the role (409)', async () => {
    await admin.patch(`/api/organisation/members/${t.outsider.id}`).send({ role: 'viewer' }).expect(404);
    const last = await admin.patch(`/api/organisation/members/${t.people.admin.id}`).send({ role: 'viewer' }).expect(409);
    expect(last.body.error.code).toBe('last_admin');
    expect((await admin.get('/api/me').expect(200)).body.role).toBe('admin');
    const bad = await admin.patch(`/api/organisation/members/not-a-uuid`).send({ role: 'viewer' }).expect(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['userId']);
  });
});
