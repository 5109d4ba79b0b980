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

  it.runIf(names.includes('tune'))('runs a command and returns its JSON answer (Den Hartog tuning)', async () => {
    const massRatio = 0.02;
    const response = await viewer.post('/api/compute/tune').send({ method: 'den-hartog', massRatio, structureFrequencyHz: 1.85 });
    expect(response.status).toBe(200);
    // Den Hartog, Mechanical Vibrations (1956): f = 1/(1+μ), ζ_a = √(3μ / (8(1+μ))) referred to the damper's own frequency.
    expect(response.body.frequencyRatio).toBeCloseTo(1 / (1 + massRatio), 6);
    expect(response.body.tmdFrequencyHz).toBeCloseTo(1.85 / (1 + massRatio), 6);
    expect(response.body.tmdDampingRatio).toBeCloseTo(Math.sqrt((3 * massRatio) / (8 * (1 + massRatio))), 6);
  });

  it.runIf(names.includes('modes'))('a request the mathematics refuses (mass matrix not positive definite) is 400 with issues', async () => {
    const response = await viewer.post('/api/compute/modes').send({
      massMatrixKg: [
        [1000, 0],
        [0, -50],
      ],
      stiffnessMatrixNPerM: [
        [2e5, -1e5],
        [-1e5, 1e5],
      ],
    });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_request');
    expect(response.body.error.issues.length).toBeGreaterThan(0);
  });

  it('GET /api/compute lists the registered commands', async () => {
    const response = await viewer.get('/api/compute').expect(200);
    expect(response.body.commands.map((c: { name: string }) => c.name).sort()).toEqual(names.sort());
  });
});
