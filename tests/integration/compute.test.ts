/**
 * POST /api/compute/:command: signed-in people only, unknown commands, and requests the command's schema refuses.
 */
import { spawnSync } from 'node:child_process';
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
    expect(response.body.error.code).toBe('invalid_json');
  });

  const names = Object.keys(computeCommands);
  it.each(names)('%s refuses a request its schema rejects with 400 and issues', async (name) => {
    const response = await viewer.post(`/api/compute/${name}`).send({ thisIsNot: 'a valid request' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_request');
    expect(response.body.error.issues.length).toBeGreaterThan(0);
  });

  it('runs a command and returns its JSON answer (Den Hartog tuning)', async () => {
    const massRatio = 0.02;
    const response = await viewer.post('/api/compute/tune').send({ method: 'den-hartog', massRatio, structureFrequencyHz: 1.85 });
    expect(response.status).toBe(200);
    // Den Hartog, Mechanical Vibrations (1956): f = 1/(1+μ), ζ_a = √(3μ / (8(1+μ))) referred to the damper's own frequency.
    expect(response.body.frequencyRatio).toBeCloseTo(1 / (1 + massRatio), 6);
    expect(response.body.tmdFrequencyHz).toBeCloseTo(1.85 / (1 + massRatio), 6);
    expect(response.body.tmdDampingRatio).toBeCloseTo(Math.sqrt((3 * massRatio) / (8 * (1 + massRatio))), 6);
  });

  it('a request the mathematics refuses (mass matrix not positive definite) is 400 with issues', async () => {
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

  it('registers every command of the engine and of the design methods', () => {
    expect(names.sort()).toEqual(['assess', 'free', 'identify', 'modes', 'response', 'robustness', 'size', 'tune']);
  });

  // The same JSON in and out as the `calc` command: one valid request per command (invented values), answered by
  // the API and by a `calc` process, must give identical answers.
  const structure = { modalMassKg: 36_000, frequencyHz: 2.02, dampingRatio: 0.006, direction: 'vertical' };
  const tmd = { massKg: 720, frequencyHz: 1.97, dampingRatio: 0.075 };
  const crowd = { kind: 'crowd', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 150, modeShapeMean: 2 / Math.PI };
  const samples: Record<string, object> = {
    modes: { massMatrixKg: [[36_000, 0], [0, 720]], stiffnessMatrixNPerM: [[5.9e6, -1.1e5], [-1.1e5, 1.1e5]] },
    tune: { method: 'hinf', massRatio: 0.02, structureFrequencyHz: 2.02, structureDampingRatio: 0.006 },
    response: { structure, tmds: [tmd], forceAmplitudeN: 900, frequenciesHz: [1.8, 1.95, 2.1, 2.3] },
    free: {
      massMatrixKg: [[36_000, 0], [0, 720]],
      stiffnessMatrixNPerM: [[5.9e6, -1.1e5], [-1.1e5, 1.1e5]],
      initialDisplacementM: [0.002, 0],
      initialVelocityMPerS: [0, 0.01],
      timesS: [0, 0.25, 0.5],
    },
    assess: { structure, tmds: [tmd], loadCase: crowd, criteria: { set: 'hivoss', class: 'CL2' } },
    size: { structure, method: 'den-hartog', loadCase: crowd, peakAccelerationLimitMPerS2: 0.5, structureFrequencyToleranceRatio: 0.1 },
    robustness: { structure, tmds: [tmd], loadCase: crowd, structureFrequencyFactors: [0.9, 1, 1.1], tmdDampingFactors: [0.5, 1, 2] },
  };
  it.each(Object.keys(samples))('%s answers through the API exactly as the calc command does', async (name) => {
    const body = samples[name];
    const api = await viewer.post(`/api/compute/${name}`).send(body);
    expect(api.status, JSON.stringify(api.body)).toBe(200);
    const cli = spawnSync(process.execPath, ['server/cli/calc.mjs', name, '-'], { input: JSON.stringify(body), encoding: 'utf8' });
    expect(cli.status, cli.stderr).toBe(0);
    expect(api.body).toEqual(JSON.parse(cli.stdout));
  });

  // Requests that used to answer nonsense or to run for minutes (a 501 × 501 map with 50 dampers ran 215 s) are
  // refused at once with 400 naming the field and the rule (docs/engine.md, "Physical ranges", "Limits of work").
  it('a non-physical request is 400 naming the field and the range', async () => {
    const response = await viewer.post('/api/compute/free').send({ ...samples.free, initialDisplacementM: [1e308, 0] });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toContainEqual({
      path: 'initialDisplacementM.0',
      message: 'initialDisplacementM.0: must be between −1000 and 1000 m (an initial displacement)',
    });
  });

  it('a request beyond the work limit is 400 naming the field', async () => {
    const factors = Array.from({ length: 501 }, (_, i) => 0.8 + (0.4 * i) / 500);
    const tmds = Array.from({ length: 50 }, () => ({ massKg: 14, frequencyHz: 1.97, dampingRatio: 0.075 }));
    const response = await viewer
      .post('/api/compute/robustness')
      .send({ structure, tmds, loadCase: crowd, structureFrequencyFactors: factors, tmdDampingFactors: factors });
    expect(response.status).toBe(400);
    const issue = response.body.error.issues.find((i: { path: string }) => i.path === 'structureFrequencyFactors');
    expect(issue.message).toMatch(/cells × dampers must be at most 60,000/);
  });

  it('GET /api/compute lists the registered commands', async () => {
    const response = await viewer.get('/api/compute').expect(200);
    expect(response.body.commands.map((c: { name: string }) => c.name).sort()).toEqual(names.sort());
  });
});
