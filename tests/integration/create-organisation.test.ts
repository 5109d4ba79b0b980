/**
 * `npm run organisation:create`: a new organisation whose first admin comes in through an invitation link, the
 * way a production database (no demo seed) gets its first people.
 */
import { spawnSync } from 'node:child_process';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { repoRoot } from '../../server/db/cluster';
import { createOrganisationWithAdmin } from '../../server/modules/members/members.service';
import { meSchema } from '../../shared/contracts/me';
import { createTestApp, signIn, type TestApp } from '../support/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  await t?.close();
});

function runCli(args: string[]) {
  return spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/create-organisation.ts', ...args], {
    cwd: repoRoot,
    encoding: 'utf8',
    // No mail relay listens on port 1: the command must still print the link.
    env: { ...process.env, NODE_ENV: 'production', DATABASE_URL: t.databaseUrl, AUTH_SECRET: 'cli-secret-0123456789abcdef0123456789', APP_URL: 'https://stillspan.example', SMTP_PORT: '1' },
    timeout: 60_000,
  });
}

describe('creating an organisation with its first admin', () => {
  it('mails the admin an invitation (service)', async () => {
    const result = await createOrganisationWithAdmin(t.ctx, { organisationName: 'Fresh Structures', adminEmail: 'First.Admin@fresh.test' });
    expect(result.mailError).toBeNull();
    expect(t.ctx.fakeSmtp!.mails()[0]).toMatchObject({ to: ['First.Admin@fresh.test'.toLowerCase()], subject: 'Join Fresh Structures on Stillspan' });
    const token = result.link.split('/invitations/')[1];
    await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'First Admin', password: 'first-admin-password' }).expect(201);
    const admin = await signIn(t.app, 'first.admin@fresh.test', 'first-admin-password');
    const me = meSchema.parse((await admin.get('/api/me').expect(200)).body);
    expect(me).toMatchObject({ role: 'admin', organisation: { id: result.organisationId, name: 'Fresh Structures' } });
    // A separate organisation: none of organisation A's projects or people.
    expect((await admin.get('/api/projects').expect(200)).body.projects).toEqual([]);
    expect((await admin.get('/api/organisation/members').expect(200)).body.members.map((m: { email: string }) => m.email)).toEqual(['first.admin@fresh.test']);
  });

  it('the command prints the link when no mail can be sent, and the link works', async () => {
    const run = runCli(['--name', 'Command-line Works', '--admin-email', 'cli.admin@cli.test']);
    expect(run.status, run.stderr).toBe(0);
    const link = run.stdout.match(/https:\/\/stillspan\.example\/invitations\/([A-Za-z0-9_-]+)/);
    expect(link, run.stdout).not.toBeNull();
    const preview = await request(t.app).get(`/api/invitations/${link![1]}`).expect(200);
    expect(preview.body).toEqual({ email: 'cli.admin@cli.test', role: 'admin', organisationName: 'Command-line Works' });
  });

  it('the command refuses bad arguments with exit 2, naming them', () => {
    const run = runCli(['--name', '', '--admin-email', 'not-an-address']);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('--name: is required');
    expect(run.stderr).toContain('--admin-email: must be an e-mail address');
    const taken = runCli(['--name', 'Again', '--admin-email', t.people.viewer.email]);
    expect(taken.status).toBe(2);
    expect(taken.stderr).toContain('already has a Stillspan account');
  });
});
