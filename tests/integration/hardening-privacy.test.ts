/**
 * The development server listens on 127.0.0.1 unless HOST says otherwise, and an invitation reveals nothing about
 * other organisations: inviting an address that has an account elsewhere is answered like a new address.
 */
import { connect } from 'node:net';
import { networkInterfaces } from 'node:os';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer } from '../../server/server';
import { invitationSchema } from '../../shared/contracts/members';
import { createTestApp, signIn, testEnv, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: Agent;

beforeAll(async () => {
  t = await createTestApp();
  admin = await signIn(t.app, t.people.admin.email);
});

afterAll(async () => {
  await t?.close();
});

function canConnect(host: string, port: number): Promise<boolean> {
  return new Promise((done) => {
    const socket = connect({ host, port, timeout: 1000 });
    socket.once('connect', () => {
      socket.destroy();
      done(true);
    });
    socket.once('error', () => done(false));
    socket.once('timeout', () => {
      socket.destroy();
      done(false);
    });
  });
}

describe('where the server listens', () => {
  it('on 127.0.0.1 by default: not on the machine’s other addresses', async () => {
    const server = await startServer(testEnv(t.databaseUrl, { PORT: '0', STILLSPAN_FAKE_SMTP: '0' }));
    try {
      expect(await canConnect('127.0.0.1', server.port)).toBe(true);
      const others = Object.values(networkInterfaces())
        .flat()
        .filter((info) => info && info.family === 'IPv4' && !info.internal)
        .map((info) => info!.address);
      for (const address of others) expect(await canConnect(address, server.port), address).toBe(false);
    } finally {
      await server.close();
    }
  });
});

describe('invitations reveal nothing about other organisations', () => {
  it('an address with an account in another organisation gets the same answer as a new one', async () => {
    const fresh = await admin.post('/api/organisation/invitations').send({ email: 'brand-new@elsewhere.test', role: 'viewer' });
    const elsewhere = await admin.post('/api/organisation/invitations').send({ email: t.outsider.email, role: 'viewer' });
    expect(elsewhere.status).toBe(fresh.status);
    expect(elsewhere.status).toBe(201);
    const strip = (body: unknown) => {
      const { id: _id, email: _email, createdAt: _c, expiresAt: _e, ...rest } = invitationSchema.parse(body);
      return rest;
    };
    expect(strip(elsewhere.body)).toEqual(strip(fresh.body));
    expect(Object.keys(elsewhere.body).sort()).toEqual(Object.keys(fresh.body).sort());
  });

  it('someone already in the admin’s own organisation is still refused (409 naming email)', async () => {
    const response = await admin.post('/api/organisation/invitations').send({ email: t.people.viewer.email, role: 'viewer' });
    expect(response.status).toBe(409);
    expect(response.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['email']);
  });
});
