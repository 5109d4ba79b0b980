import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { freeResponseSchema, modesResponseSchema, responseResponseSchema, tuneResponseSchema } from '../../shared/contracts/compute';

const root = resolve(__dirname, '..', '..');
const launcher = join(root, 'server', 'cli', 'calc.mjs');
const scratch = mkdtempSync(join(tmpdir(), 'stillspan-calc-'));
/** Each test starts several calc processes (0.1–0.4 s each, more on a loaded machine): more than the unit default of 5 s. */
const processTests = { timeout: 30_000 };

function calc(args: string[], stdin?: string) {
  const result = spawnSync(process.execPath, [launcher, ...args], { cwd: root, input: stdin ?? '', encoding: 'utf8', timeout: 60_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** Runs calc with the request on standard input and expects exit 2 with the error JSON as the last stderr line. */
function expectRefused(command: string, request: unknown, code: string, path: string, message: RegExp) {
  const result = calc([command, '-'], typeof request === 'string' ? request : JSON.stringify(request));
  expect(result.status).toBe(2);
  expect(result.stdout).toBe('');
  const lines = result.stderr.trim().split('\n');
  const body = apiErrorSchema.parse(JSON.parse(lines[lines.length - 1]));
  expect(body.error.code).toBe(code);
  const issue = body.error.issues.find((candidate) => candidate.path === path);
  expect(issue, `an issue at path "${path}" in ${JSON.stringify(body.error.issues)}`).toBeDefined();
  expect(issue!.message).toMatch(message);
  return body;
}

const modesRequest = {
  massMatrixKg: [
    [4000, 0],
    [0, 2500],
  ],
  stiffnessMatrixNPerM: [
    [9e5, -3e5],
    [-3e5, 3e5],
  ],
};
const tuneRequest = { method: 'den-hartog', massRatio: 0.02, structureFrequencyHz: 1.9, structureDampingRatio: 0.006 };
const responseRequest = {
  structure: { modalMassKg: 36000, frequencyHz: 2.05, dampingRatio: 0.005 },
  tmds: [{ massKg: 720, frequencyHz: 2.0, dampingRatio: 0.085 }],
  forceAmplitudeN: 280,
  frequenciesHz: [1.6, 1.8, 2.0, 2.2, 2.4],
};
const freeRequest = { ...modesRequest, initialDisplacementM: [0.01, 0], initialVelocityMPerS: [0, 0.02], timesS: [0, 0.25, 0.5] };

describe('calc: answers', processTests, () => {
  it('modes: JSON on stdout, exit 0, from a file', () => {
    const file = join(scratch, 'modes.json');
    writeFileSync(file, JSON.stringify(modesRequest));
    const result = calc(['modes', file]);
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const answer = modesResponseSchema.parse(JSON.parse(result.stdout));
    expect(answer.modes).toHaveLength(2);
    expect(answer.modes[0].frequencyHz).toBeLessThan(answer.modes[1].frequencyHz);
    expect(answer.modes[0].angularFrequencyRadPerS).toBeCloseTo(2 * Math.PI * answer.modes[0].frequencyHz, 12);
  });

  it('reads a relative path from the directory the command was typed in, through npm', () => {
    writeFileSync(join(scratch, 'tune.json'), JSON.stringify(tuneRequest));
    const result = spawnSync('npm', ['--prefix', root, 'run', '--silent', 'calc', '--', 'tune', 'tune.json'], { cwd: scratch, encoding: 'utf8', timeout: 60_000 });
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    expect(tuneResponseSchema.parse(JSON.parse(result.stdout)).frequencyRatio).toBeCloseTo(1 / 1.02, 14);
  });

  it('tune, response and free from standard input', () => {
    const tune = calc(['tune', '-'], JSON.stringify(tuneRequest));
    expect(tune.status).toBe(0);
    const tuned = tuneResponseSchema.parse(JSON.parse(tune.stdout));
    expect(tuned.frequencyRatio).toBeCloseTo(1 / 1.02, 14);
    expect(tuned.tmdFrequencyHz).toBeCloseTo(1.9 / 1.02, 14);
    const response = calc(['response', '-'], JSON.stringify(responseRequest));
    expect(response.status).toBe(0);
    const answer = responseResponseSchema.parse(JSON.parse(response.stdout));
    expect(answer.points).toHaveLength(5);
    expect(answer.points[0].tmdStrokeM).toHaveLength(1);
    expect(answer.peak.structureAccelerationMPerS2).toBeGreaterThanOrEqual(Math.max(...answer.points.map((p) => p.structureAccelerationMPerS2)));
    const free = calc(['free', '-'], JSON.stringify(freeRequest));
    expect(free.status).toBe(0);
    const motion = freeResponseSchema.parse(JSON.parse(free.stdout));
    expect(motion.displacementsM).toHaveLength(3);
    expect(motion.displacementsM[0][0]).toBeCloseTo(0.01, 14);
  });

  it('the structure damping ratio of tune defaults to 0', () => {
    const result = calc(['tune', '-'], JSON.stringify({ method: 'den-hartog', massRatio: 0.05, structureFrequencyHz: 2 }));
    expect(result.status).toBe(0);
    const answer = tuneResponseSchema.parse(JSON.parse(result.stdout));
    // Undamped structure: the peak lies just above Den Hartog's fixed-point height √(1 + 2/μ) (Den Hartog, Mechanical
    // Vibrations, 1956; see tests/reference/tuning-reference.test.ts); a structure damping above 0 would lower it below.
    expect(answer.peakAmplification / Math.sqrt(1 + 2 / 0.05)).toBeGreaterThan(1);
    expect(answer.peakAmplification / Math.sqrt(1 + 2 / 0.05)).toBeLessThan(1.002);
  });

  it('prints its usage with --help', () => {
    const result = calc(['--help']);
    expect(result.status).toBe(0);
    expect(result.stdout).toMatch(/modes/);
    expect(result.stdout).toMatch(/qualified engineer/);
  });
});

describe('calc: refusals (exit 2, error JSON as the last stderr line)', processTests, () => {
  it('unknown command, unreadable file, invalid JSON, wrong arguments', () => {
    expectRefused('shake', {}, 'unknown_command', '', /command: must be one of .*free, identify, modes, response.*tune/);
    const missing = calc(['modes', join(scratch, 'nowhere.json')]);
    expect(missing.status).toBe(2);
    const lines = missing.stderr.trim().split('\n');
    expect(apiErrorSchema.parse(JSON.parse(lines[lines.length - 1])).error.code).toBe('unreadable_input');
    expectRefused('modes', '{"massMatrixKg": [[1]', 'unreadable_input', '', /request: must be valid JSON/);
    const none = calc([]);
    expect(none.status).toBe(2);
    expect(apiErrorSchema.parse(JSON.parse(none.stderr.trim().split('\n').pop()!)).error.code).toBe('invalid_request');
  });

  it('matrix shapes', () => {
    expectRefused('modes', { ...modesRequest, massMatrixKg: [[4000, 0], [0]] }, 'invalid_request', 'massMatrixKg.1', /must have 2 entries/);
    expectRefused('modes', { ...modesRequest, stiffnessMatrixNPerM: [[1]] }, 'invalid_request', 'stiffnessMatrixNPerM', /must be 2×2 like massMatrixKg/);
    expectRefused('modes', { ...modesRequest, massMatrixKg: [] }, 'invalid_request', 'massMatrixKg', /at least one row/);
    expectRefused('modes', { ...modesRequest, massMatrixKg: 'diag' }, 'invalid_request', 'massMatrixKg', /array of rows/);
    expectRefused('free', { ...freeRequest, initialVelocityMPerS: [0] }, 'invalid_request', 'initialVelocityMPerS', /must have 2 entries, one per DOF/);
    expectRefused('response', { ...responseRequest, frequenciesHz: [] }, 'invalid_request', 'frequenciesHz', /at least one frequency/);
    const chain = (n: number) => ({
      massMatrixKg: Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 100 : 0))),
      stiffnessMatrixNPerM: Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 2e5 : Math.abs(i - j) === 1 ? -1e5 : 0))),
      initialDisplacementM: new Array(n).fill(0.001),
      initialVelocityMPerS: new Array(n).fill(0),
    });
    const times = (count: number) => Array.from({ length: count }, (_, i) => i * 1e-3);
    expectRefused('free', { ...chain(20), timesS: times(60000) }, 'invalid_request', 'timesS', /times × DOF must be at most 1,000,000 values/);
    expectRefused('free', { ...chain(300), timesS: times(3000) }, 'invalid_request', 'timesS', /times × DOF² must be at most 200,000,000/);
  });

  it('symmetry, finiteness and strings for numbers', () => {
    expectRefused('modes', { ...modesRequest, massMatrixKg: [[4000, 10], [0, 2500]] }, 'invalid_request', 'massMatrixKg.1.0', /must be symmetric/);
    expectRefused('modes', '{"massMatrixKg":[[1e999,0],[0,1]],"stiffnessMatrixNPerM":[[1,0],[0,1]]}', 'invalid_request', 'massMatrixKg.0.0', /must be a finite number/);
    expectRefused('modes', { ...modesRequest, stiffnessMatrixNPerM: [[9e5, '-3e5'], [-3e5, 3e5]] }, 'invalid_request', 'stiffnessMatrixNPerM.0.1', /must be a finite number/);
    expectRefused('tune', { ...tuneRequest, massRatio: '0.02' }, 'invalid_request', 'massRatio', /must be a finite number/);
    expectRefused('response', { ...responseRequest, frequenciesHz: [1.6, 'x'] }, 'invalid_request', 'frequenciesHz.1', /must be a finite number/);
  });

  it('positive definiteness of the mass matrix, masses, frequencies, mass ratios', () => {
    expectRefused('modes', { ...modesRequest, massMatrixKg: [[1000, 2000], [2000, 1000]] }, 'invalid_request', 'massMatrixKg', /must be positive definite/);
    expectRefused('modes', { ...modesRequest, massMatrixKg: [[4000, 0], [0, 0]] }, 'invalid_request', 'massMatrixKg.1.1', /must be greater than 0/);
    expectRefused('modes', { ...modesRequest, stiffnessMatrixNPerM: [[1, 0], [0, -1]] }, 'invalid_request', 'stiffnessMatrixNPerM.1.1', /must be at least 0/);
    expectRefused('modes', { ...modesRequest, stiffnessMatrixNPerM: [[1, 3], [3, 1]] }, 'invalid_request', 'stiffnessMatrixNPerM', /must be positive semi-definite/);
    expectRefused('tune', { ...tuneRequest, massRatio: 0 }, 'invalid_request', 'massRatio', /greater than 0/);
    expectRefused('tune', { ...tuneRequest, massRatio: -0.01 }, 'invalid_request', 'massRatio', /greater than 0/);
    expectRefused('tune', { ...tuneRequest, structureFrequencyHz: 0 }, 'invalid_request', 'structureFrequencyHz', /greater than 0/);
    expectRefused('response', { ...responseRequest, structure: { ...responseRequest.structure, modalMassKg: -1 } }, 'invalid_request', 'structure.modalMassKg', /greater than 0/);
    expectRefused('response', { ...responseRequest, tmds: [{ massKg: 0, frequencyHz: 2, dampingRatio: 0.1 }] }, 'invalid_request', 'tmds.0.massKg', /greater than 0/);
    expectRefused('response', { ...responseRequest, frequenciesHz: [1, -2] }, 'invalid_request', 'frequenciesHz.1', /greater than 0/);
    expectRefused('response', { ...responseRequest, forceAmplitudeN: 0 }, 'invalid_request', 'forceAmplitudeN', /greater than 0/);
  });

  it('damping ratios outside [0, 1), unknown methods and unknown fields', () => {
    expectRefused('tune', { ...tuneRequest, structureDampingRatio: 1 }, 'invalid_request', 'structureDampingRatio', /damping ratio in \[0, 1\)/);
    expectRefused('tune', { ...tuneRequest, structureDampingRatio: -0.01 }, 'invalid_request', 'structureDampingRatio', /damping ratio in \[0, 1\)/);
    expectRefused('response', { ...responseRequest, tmds: [{ massKg: 700, frequencyHz: 2, dampingRatio: 1.5 }] }, 'invalid_request', 'tmds.0.dampingRatio', /damping ratio in \[0, 1\)/);
    expectRefused('tune', { ...tuneRequest, method: 'optimal' }, 'invalid_request', 'method', /must be one of den-hartog, warburton-random, ioi-ikeda, hinf, h2/);
    expectRefused('tune', { ...tuneRequest, structureDampingRation: 0.01 }, 'invalid_request', 'structureDampingRation', /structureDampingRation: is not a known field/);
    expectRefused('tune', { method: 'hinf', structureFrequencyHz: 2 }, 'invalid_request', 'massRatio', /massRatio: is required/);
    expectRefused('tune', { ...tuneRequest, method: 'hinf', structureDampingRatio: 0.8 }, 'invalid_request', 'structureDampingRatio', /must be below 1\/√2/);
  });

  it('an undamped resonance inside the requested band', () => {
    expectRefused(
      'response',
      { ...responseRequest, structure: { ...responseRequest.structure, dampingRatio: 0 }, tmds: [] },
      'invalid_request',
      'frequenciesHz',
      /unbounded/,
    );
  });
});

describe('calc: start-up', processTests, () => {
  it('runs through npm run --silent calc with the same answer', () => {
    const result = spawnSync('npm', ['run', '--silent', 'calc', '--', 'tune', '-'], { cwd: root, input: JSON.stringify(tuneRequest), encoding: 'utf8', timeout: 60_000 });
    expect(result.status).toBe(0);
    expect(tuneResponseSchema.parse(JSON.parse(result.stdout)).frequencyRatio).toBeCloseTo(1 / 1.02, 14);
  });
});
