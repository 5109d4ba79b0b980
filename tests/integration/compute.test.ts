/**
 * POST /api/compute/:command: signed-in people only, unknown commands, and requests the command's schema refuses.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeCommands } from '../../shared/compute/commands';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let viewer: Agent;

beforeAll(async () => {
  t = await createTestApp();
  viewer = await signIn(t.app, t.people.viewer.email);
});

afterAll(async () => {
  await t?.close();
});

describe('POST /api/compute/:command', () => {
  it('needs a session (401)', async () => {
    const response = await request(t.app).post('/api/compute/anything').send({});
    expect(response.status).toBe(401);
  });

  it('an unknown command is 404 unknown_command', async () => {
    const response = await viewer.post('/api/compute/no-such-command').send({});
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('unknown_command');
    await viewer.post('/api/compute/toString').send({}).expect(404);
  });

  it('invalid JSON is 400', async () => {
    const response = await viewer.post('/api/compute/no-such-command').set('Content-Type', 'application/json').send('{');
    expect(response.status).toBe(400);
  });

  const names = Object.keys(computeCommands);
  it.runIf(names.length > 0).each(names)('%s refuses a request its schema rejects with 400 and issues', async (name) => {
    const response = await viewer.post(`/api/compute/${name}`).send({ thisIsNot: 'a valid request' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_request');
    expect(response.body.error.issues.length).toBeGreaterThan(0);
  });

  it('GET /api/compute lists the registered commands', async () => {
    const response = await viewer.get('/api/compute').expect(200);
    expect(response.body.commands.map((c: { name: string }) => c.name).sort()).toEqual(names.sort());
  });
});
