/**
 * Physical ranges and limits of work of the compute commands: each request that used to answer nonsense (nulls, a
 * 0 Hz mode) or to run for minutes is refused naming the field and the rule. Values are invented for the checks.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { getComputeCommand } from './commands';
import { ComputeInputError } from './types';
import { toApiIssues } from '../contracts/errors';
import { MAX_RESPONSE_WORK } from '../contracts/compute';
import { MAX_ROBUSTNESS_WORK } from '../contracts/compute-design';

type Issue = { path: string; message: string };

/** The issues of a request, from the schema or from the run (a refusal only the engine finds); [] when answered. */
function issuesOf(command: string, body: unknown): Issue[] {
  const c = getComputeCommand(command)!;
  const parsed = c.request.safeParse(body);
  if (!parsed.success) return toApiIssues(parsed.error as z.ZodError);
  try {
    c.run(parsed.data);
  } catch (error) {
    if (error instanceof ComputeInputError) return error.issues;
    throw error;
  }
  return [];
}

function expectRefused(command: string, body: unknown, path: string, rule: RegExp): void {
  const issues = issuesOf(command, body);
  const hit = issues.find((i) => i.path === path);
  expect(hit, JSON.stringify(issues)).toBeDefined();
  expect(hit!.message).toMatch(rule);
}

const structure = { modalMassKg: 40_000, frequencyHz: 2, dampingRatio: 0.005, direction: 'vertical' };
const tmd = { massKg: 800, frequencyHz: 1.96, dampingRatio: 0.08 };
const crowd = { kind: 'crowd', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 150 };
const twoDof = { massMatrixKg: [[4000, 0], [0, 2500]], stiffnessMatrixNPerM: [[9e5, -3e5], [-3e5, 3e5]] };
const dampers = (n: number) => Array.from({ length: n }, (_, j) => ({ massKg: 800 / n, frequencyHz: 1.9 + (0.1 * j) / n, dampingRatio: 0.08 }));
const range = (n: number, lo: number, hi: number) => Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / Math.max(1, n - 1));

describe('physically meaningful inputs', () => {
  it('free: 1e308 m initial displacements (answered with nulls before)', () => {
    const body = { ...twoDof, initialDisplacementM: [1e308, 0], initialVelocityMPerS: [0, 0], timesS: [0, 1] };
    expectRefused('free', body, 'initialDisplacementM.0', /between −1000 and 1000 m \(an initial displacement\)/);
    expectRefused('free', { ...body, initialDisplacementM: [0, 0], initialVelocityMPerS: [0, -1e9] }, 'initialVelocityMPerS.1', /between −1000 and 1000 m\/s/);
    expectRefused('free', { ...body, initialDisplacementM: [0.01, 0], timesS: [0, 1e300] }, 'timesS.1', /between −1e6 and 1e6 s \(a time\)/);
  });

  it('a 1e-300 kg modal mass with a 1e300 kg damper (massRatio: null before)', () => {
    const body = { structure: { ...structure, modalMassKg: 1e-300 }, tmds: [{ ...tmd, massKg: 1e300 }], loadCase: crowd };
    expectRefused('assess', body, 'structure.modalMassKg', /between 0\.001 and 1e12 kg \(a modal mass\)/);
    expectRefused('assess', body, 'tmds.0.massKg', /between 0\.001 and 1e12 kg \(a damper mass\)/);
    expectRefused('response', { structure: body.structure, tmds: body.tmds, forceAmplitudeN: 100, frequenciesHz: [2] }, 'structure.modalMassKg', /between 0\.001 and 1e12 kg/);
  });

  it('dampers heavier together than the modal mass (mass ratio above 1, as tune refuses)', () => {
    const heavy = [{ ...tmd, massKg: 30_000 }, { ...tmd, massKg: 20_000 }];
    expectRefused('assess', { structure, tmds: heavy, loadCase: crowd }, 'tmds', /total mass 50000 kg must be at most 1 × the modal mass 40000 kg \(mass ratio ≤ 1; got 1\.25\)/);
    expectRefused('response', { structure, tmds: heavy, forceAmplitudeN: 100, frequenciesHz: [2] }, 'tmds', /mass ratio ≤ 1/);
    expectRefused('robustness', { structure, tmds: heavy, loadCase: crowd, structureFrequencyFactors: [1], tmdDampingFactors: [1] }, 'tmds', /mass ratio ≤ 1/);
  });

  it('modes: M = [[1e-308]], K = [[1e308]] (0 Hz before)', () => {
    const body = { massMatrixKg: [[1e-308]], stiffnessMatrixNPerM: [[1e308]] };
    expectRefused('modes', body, 'massMatrixKg.0.0', /between 0\.001 and 1e12 kg \(a diagonal mass\)/);
    expectRefused('modes', body, 'stiffnessMatrixNPerM.0.0', /between −1e20 and 1e20 N\/m/);
  });

  it('modes: the condition of the matrices (diagonal entries over more than 12 orders of magnitude)', () => {
    expectRefused('modes', { massMatrixKg: [[1e10, 0], [0, 1e-3]], stiffnessMatrixNPerM: [[1, 0], [0, 1]] }, 'massMatrixKg.1.1', /at least 0\.01 kg, 1\/1e12 of the largest diagonal entry \(10000000000 kg at \(0, 0\)\)/);
    // A stiff DOF beside a soft one: the soft mode would read as a rigid-body mode.
    expectRefused('modes', { massMatrixKg: [[1, 0], [0, 1]], stiffnessMatrixNPerM: [[1e15, 0], [0, 10]] }, 'stiffnessMatrixNPerM.1.1', /1\/1e12 of the largest/);
    expectRefused('modes', { massMatrixKg: [[1, 1e13], [1e13, 1]], stiffnessMatrixNPerM: [[1, 0], [0, 1]] }, 'massMatrixKg.1.0', /between −1e12 and 1e12 kg/);
    // A free–free chain still has its rigid-body mode (stiffness diagonals all alike).
    expect(issuesOf('modes', { massMatrixKg: [[1, 0], [0, 1]], stiffnessMatrixNPerM: [[1, -1], [-1, 1]] })).toEqual([]);
  });

  it('a damper lighter than a millionth of the modal mass, and tune below that mass ratio', () => {
    // μ = 1e-12 made the h2 search fail with an internal error before.
    expectRefused('tune', { method: 'h2', massRatio: 1e-12, structureFrequencyHz: 2 }, 'massRatio', /must be at least 1e-6/);
    expectRefused('tune', { method: 'h2', massRatio: 0, structureFrequencyHz: 2 }, 'massRatio', /greater than 0/);
    // A 1e12 kg mode with a 1 g damper: the coupled mass matrix was refused deep inside the moving walker as `massKg`.
    const body = { structure: { ...structure, modalMassKg: 1e12 }, tmds: [tmd, { ...tmd, massKg: 1e-3 }], loadCase: { kind: 'moving-walker', spanM: 10 } };
    expectRefused('assess', body, 'tmds.1.massKg', /at least 1e-6 × the modal mass, 1e6 kg \(mass ratio ≥ 1e-6; got 1e-15\)/);
  });

  it('load cases: people, crowds and decks of a possible size', () => {
    expectRefused('assess', { structure, loadCase: { kind: 'walker', bodyWeightN: 1e300 } }, 'loadCase.bodyWeightN', /at most 10000 N \(the body weight of one person\)/);
    expectRefused('assess', { structure, loadCase: { kind: 'moving-walker', spanM: 30, walkingSpeedMPerS: 1e300 } }, 'loadCase.walkingSpeedMPerS', /at most 15 m\/s/);
    expectRefused('assess', { structure, loadCase: { ...crowd, densityPerM2: 1e300, deckAreaM2: 1e300 } }, 'loadCase.densityPerM2', /at most 10 persons\/m²/);
    expectRefused('assess', { structure, loadCase: { ...crowd, deckAreaM2: 1e300 } }, 'loadCase.deckAreaM2', /at most 1e6 m²/);
    expectRefused('assess', { structure: { ...structure, frequencyHz: 5 }, loadCase: { kind: 'floor-walking', constantForceN: 1e300 } }, 'loadCase.constantForceN', /at most 1e9 N/);
    expectRefused('assess', { structure: { ...structure, frequencyHz: 5 }, loadCase: { kind: 'floor-walking', effectiveWeightN: 1e300 } }, 'loadCase.effectiveWeightN', /at most 1e14 N/);
    expectRefused('assess', { structure, loadCase: { kind: 'moving-walker', spanM: 30, trailingTimeS: 1e300 } }, 'loadCase.trailingTimeS', /time steps/);
  });

  it('frequencies, forces and bands outside the physical range', () => {
    expectRefused('tune', { method: 'den-hartog', massRatio: 0.02, structureFrequencyHz: 1e6 }, 'structureFrequencyHz', /between 0\.01 and 1000 Hz \(a natural frequency\)/);
    expectRefused('response', { structure, tmds: [tmd], forceAmplitudeN: 1e300, frequenciesHz: [2] }, 'forceAmplitudeN', /at most 1e9 N/);
    expectRefused('response', { structure, tmds: [tmd], forceAmplitudeN: 100, frequenciesHz: [2, 1e-6] }, 'frequenciesHz.1', /between 0\.01 and 1000 Hz \(a forcing frequency\)/);
    expectRefused('assess', { structure, tmds: [tmd], loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [1e-9, 2] } }, 'loadCase.pacingRangeHz.0', /between 0\.01 and 1000 Hz/);
    expectRefused('robustness', { structure, tmds: [tmd], loadCase: crowd, structureFrequencyFactors: [1, 600], tmdDampingFactors: [1] }, 'structureFrequencyFactors.1', /1200 Hz: it must stay between 0\.01 and 1000 Hz/);
    expectRefused('size', { structure: { ...structure, frequencyHz: 900 }, method: 'den-hartog', loadCase: { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [800, 1000] }, peakAccelerationLimitMPerS2: 1, structureFrequencyToleranceRatio: 0.2 }, 'structureFrequencyToleranceRatio', /over 720–1080 Hz: it must stay between 0\.01 and 1000 Hz/);
  });

  it('moving walker: a 1e300 s time step must be finer than the motion (1/(20 f) of the highest frequency)', () => {
    const body = { structure, tmds: [tmd], loadCase: { kind: 'moving-walker', spanM: 30, timeStepS: 1e300 } };
    // The walking harmonics reach 3 × 2 Hz = 6 Hz (Bachmann & Ammann 1987, from memory): at most 1/(20 × 6 Hz).
    expectRefused('assess', body, 'loadCase.timeStepS', /must be finer than the motion: at most 1\/\(20 × 6\.000 Hz\) = 0\.00833 s/);
    expect(issuesOf('assess', { ...body, loadCase: { ...body.loadCase, timeStepS: 0.005 } })).toEqual([]);
  });
});

describe('limits of work (each command at most a few seconds, answers under about 20 MB)', () => {
  it('robustness: cells × dampers (a 501 × 501 map with 50 dampers ran 215 s)', () => {
    const big = { structure, tmds: dampers(50), loadCase: crowd, structureFrequencyFactors: range(501, 0.8, 1.2), tmdDampingFactors: range(501, 0.5, 1.5) };
    expectRefused('robustness', big, 'structureFrequencyFactors', /cells × dampers must be at most 60,000 \(got 501 × 501 cells × 50 dampers = 12,550,050\)/);
    const justOver = { ...big, tmds: [tmd], structureFrequencyFactors: range(245, 0.8, 1.2), tmdDampingFactors: range(245, 0.5, 1.5) };
    expect(245 * 245).toBeGreaterThan(MAX_ROBUSTNESS_WORK);
    expectRefused('robustness', justOver, 'structureFrequencyFactors', /at most 60,000/);
    expect(getComputeCommand('robustness')!.request.safeParse({ ...justOver, tmdDampingFactors: range(244, 0.5, 1.5) }).success).toBe(true);
  });

  it('response: frequencies × dampers', () => {
    const body = { structure, tmds: dampers(10), forceAmplitudeN: 100, frequenciesHz: range(MAX_RESPONSE_WORK / 10 + 1, 1, 3) };
    expectRefused('response', body, 'frequenciesHz', /frequencies × dampers must be at most 350,000 \(got 35,001 × 10 = 350,010\)/);
    expect(getComputeCommand('response')!.request.safeParse({ ...body, frequenciesHz: body.frequenciesHz.slice(1) }).success).toBe(true);
  });

  it('moving walker: time steps × (1 + dampers)²', () => {
    expectRefused('assess', { structure, tmds: dampers(50), loadCase: { kind: 'moving-walker', spanM: 1000 } }, 'tmds', /time steps × \(1 \+ dampers\)² must be at most 200,000,000/);
  });

  it('moving walker: a time step given too fine for the crossing names timeStepS', () => {
    expectRefused('assess', { structure, tmds: [tmd], loadCase: { kind: 'moving-walker', spanM: 100, timeStepS: 1e-6 } }, 'loadCase.timeStepS', /time steps .* more than 300,000/);
  });
});

describe('torsional modes', () => {
  const torsional = { ...structure, direction: 'torsional' };
  const harmonic = { kind: 'harmonic', modalForceAmplitudeN: 300, pacingRangeHz: [1.6, 2.4] };

  it('assess: a harmonic modal force on a torsional mode, checked with the horizontal limit of EN 1990 A2.4.3.2', () => {
    const assess = getComputeCommand('assess')!;
    const answer = assess.run(assess.request.parse({ structure: torsional, tmds: [tmd], loadCase: harmonic, criteria: { set: 'en1990', class: 'normal-use' } }));
    expect(assess.response.safeParse(answer).success).toBe(true);
    // EN 1990 A2.4.3.2: 0.2 m/s² horizontal in normal use, applied to torsional modes below 2.5 Hz.
    expect(answer.criterion.limitMPerS2).toBe(0.2);
    expect(answer.peakAccelerationMPerS2).toBeGreaterThan(0);
  });

  it('response: a torsional mode answers exactly as the same mode given as vertical', () => {
    const response = getComputeCommand('response')!;
    const body = { tmds: [tmd], forceAmplitudeN: 300, frequenciesHz: [1.8, 2, 2.2] };
    expect(response.run(response.request.parse({ ...body, structure: torsional }))).toEqual(response.run(response.request.parse({ ...body, structure })));
  });

  it('a walker and a jogger are accepted on a torsional mode (the vertical force on its eccentric ordinate)', () => {
    expect(issuesOf('assess', { structure: torsional, tmds: [tmd], loadCase: { kind: 'walker', modeShapeValue: 0.5 } })).toEqual([]);
    expect(getComputeCommand('assess')!.request.safeParse({ structure: torsional, tmds: [tmd], loadCase: { kind: 'jogger' } }).success).toBe(true);
  });

  it('load cases that have no torsional form are refused naming structure.direction', () => {
    expectRefused('assess', { structure: torsional, tmds: [tmd], loadCase: { kind: 'moving-walker', spanM: 30 } }, 'structure.direction', /must be "vertical" for a moving-walker load case/);
    expectRefused('assess', { structure: torsional, tmds: [tmd], loadCase: { kind: 'floor-walking' } }, 'structure.direction', /"vertical"/);
    expectRefused('assess', { structure: torsional, tmds: [tmd], loadCase: { ...crowd, kind: 'lateral' } }, 'structure.direction', /must be "lateral"/);
    expectRefused('assess', { structure: { ...structure, direction: 'lateral' }, tmds: [tmd], loadCase: { kind: 'jogger' } }, 'structure.direction', /"vertical" or "torsional".*no horizontal jogging force/);
  });
});

describe('a refusal moved under the place that holds the request', () => {
  it('prefixes every issue path and the message', () => {
    const error = new ComputeInputError('structure.dampingRatio: is 0', [{ path: 'structure.dampingRatio', message: 'structure.dampingRatio: is 0' }]);
    const moved = error.prefixed('variants.2');
    expect(moved.issues).toEqual([{ path: 'variants.2.structure.dampingRatio', message: 'variants.2.structure.dampingRatio: is 0' }]);
    expect(moved.message).toBe('variants.2.structure.dampingRatio: is 0');
    expect(moved).toBeInstanceOf(ComputeInputError);
  });
});
