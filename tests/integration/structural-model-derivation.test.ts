/**
 * Derived modes against a real PostgreSQL: numbers the server derives from a beam or from a saved lumped model,
 * checked against handbook formulas and an independent eigen-solver (mathjs), re-derived when the model changes,
 * and the refusals that keep a derived mode and its source consistent.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { eigs, inv, multiply, sqrtm } from 'mathjs';
import { lumpedModels, structureModes } from '../../server/db/schema';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { lumpedModelSchema, savedModeSchema, type LumpedModel, type SavedMode } from '../../shared/contracts/model';
import { projectSchema } from '../../shared/contracts/projects';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;
let projectId: string;
let structureId: string;
let otherStructureId: string;
const base = () => `/api/projects/${projectId}/structures/${structureId}`;

function expectError(body: unknown, code: string) {
  const parsed = apiErrorSchema.parse(body);
  expect(parsed.error.code).toBe(code);
  return parsed.error;
}
const issuePaths = (body: unknown) => apiErrorSchema.parse(body).error.issues.map((issue) => issue.path);
const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signIn(t.app, t.people.engineer.email);
  projectId = projectSchema.parse((await engineer.post('/api/projects').send({ name: 'Derivation test bridge', kind: 'footbridge' }).expect(201)).body).id;
  structureId = (await engineer.post(`/api/projects/${projectId}/structures`).send({ name: 'Main span', kind: 'footbridge-span' }).expect(201)).body.id;
  otherStructureId = (await engineer.post(`/api/projects/${projectId}/structures`).send({ name: 'Approach span', kind: 'footbridge-span' }).expect(201)).body.id;
});

afterAll(async () => {
  await t?.close();
});

/** Second opinion (mathjs, npm): eigs of M^(-1/2) K M^(-1/2); φ = M^(-1/2) v / |v| is mass-normalised. Ascending. */
function referenceModes(massKg: number[][], stiffnessNPerM: number[][]) {
  const mInvSqrt = inv(sqrtm(massKg) as number[][]) as number[][];
  const a = multiply(multiply(mInvSqrt, stiffnessNPerM), mInvSqrt) as number[][];
  const symmetric = a.map((row, i) => row.map((v, j) => 0.5 * (v + a[j][i])));
  const { eigenvectors } = eigs(symmetric);
  return eigenvectors
    .map(({ value, vector }) => {
      const v = vector as number[];
      const length = Math.hypot(...v);
      const phi = (multiply(mInvSqrt, v) as number[]).map((entry) => entry / length);
      return { eigenvalue: value as number, frequencyHz: Math.sqrt(value as number) / (2 * Math.PI), phi };
    })
    .sort((p, q) => p.eigenvalue - q.eigenvalue);
}

// Test inputs (not values of any real structure): a three-mass model with a coupled (non-diagonal) mass matrix.
const massKg = [
  [3000, 200, 0],
  [200, 2500, 150],
  [0, 150, 1800],
];
const stiffnessNPerM = [
  [9e6, -4e6, 0],
  [-4e6, 7e6, -3e6],
  [0, -3e6, 3e6],
];

async function createModel(body: Record<string, unknown>, structure = structureId): Promise<LumpedModel> {
  return lumpedModelSchema.parse((await engineer.post(`/api/projects/${projectId}/structures/${structure}/models`).send(body).expect(201)).body);
}
async function createMode(body: Record<string, unknown>): Promise<SavedMode> {
  return savedModeSchema.parse((await engineer.post(`${base()}/modes`).send(body).expect(201)).body);
}
async function getMode(id: string): Promise<SavedMode> {
  return savedModeSchema.parse((await engineer.get(`${base()}/modes/${id}`).expect(200)).body);
}
async function getModel(id: string): Promise<LumpedModel> {
  return lumpedModelSchema.parse((await engineer.get(`${base()}/models/${id}`).expect(200)).body);
}

describe('lumped models', () => {
  it('every read carries the undamped modes, equal to mathjs eigs on M^(-1/2) K M^(-1/2) (frequencies and mass-normalised shapes)', async () => {
    const created = await createModel({ name: 'Three masses', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM, dofLabels: ['a', 'b', 'c'] });
    const reference = referenceModes(massKg, stiffnessNPerM);
    for (const model of [created, await getModel(created.id)]) {
      expect(model.modes).toHaveLength(3);
      model.modes.forEach((mode, r) => {
        expect(relative(mode.frequencyHz, reference[r].frequencyHz)).toBeLessThan(1e-9);
        expect(relative(mode.angularFrequencyRadPerS, 2 * Math.PI * reference[r].frequencyHz)).toBeLessThan(1e-9);
        // Same shape up to its sign.
        const sign = Math.sign(mode.shape[0] * reference[r].phi[0]);
        const largest = Math.max(...reference[r].phi.map(Math.abs));
        mode.shape.forEach((entry, i) => expect(Math.abs(entry - sign * reference[r].phi[i]) / largest).toBeLessThan(1e-9));
      });
    }
  });
});

describe('a mode taken from a lumped model', () => {
  it('stores that mode’s frequency and modal mass 1/φ² at the damper’s DOF (mathjs shape), with ψᵀKψ = M ω² for ψ = φ/φ_d', async () => {
    const model = await createModel({ name: 'Model for modes', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM });
    const reference = referenceModes(massKg, stiffnessNPerM);
    for (const [modeNumber, dofIndex] of [
      [1, 2],
      [2, 0],
      [3, 1],
    ] as const) {
      const mode = await createMode({ label: `Mode ${modeNumber} at DOF ${dofIndex}`, dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber, dofIndex } });
      const expected = reference[modeNumber - 1];
      const phiD = expected.phi[dofIndex];
      expect(relative(mode.frequencyHz, expected.frequencyHz)).toBeLessThan(1e-9);
      expect(relative(mode.modalMassKg, 1 / (phiD * phiD))).toBeLessThan(1e-9);
      // Modal stiffness of the shape scaled to 1 at the DOF: ψᵀKψ = modal mass × ω² (common practice: K = M ω²).
      const psi = expected.phi.map((entry) => entry / phiD);
      const kPsi = multiply(stiffnessNPerM, psi) as number[];
      const modalStiffness = psi.reduce((sum, entry, i) => sum + entry * kPsi[i], 0);
      expect(relative(modalStiffness, mode.modalMassKg * expected.eigenvalue)).toBeLessThan(1e-9);
      expect(mode.source).toEqual({ kind: 'lumped-model', modelId: model.id, modeNumber, dofIndex });
      expect(mode.modeShapeMean).toBeNull();
      const [row] = await t.ctx.db.select().from(structureModes).where(eq(structureModes.id, mode.id));
      expect(row.lumpedModelId).toBe(model.id);
    }
  });

  it('is re-derived, in the same change, when the model’s matrices change (mathjs on the new matrices)', async () => {
    const model = await createModel({ name: 'Model to stiffen', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM });
    const mode = await createMode({ label: 'Follows the model', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 2 } });
    const stiffer = stiffnessNPerM.map((row) => row.map((entry) => entry * 1.21));
    stiffer[2][2] = 3.3e6;
    const changed = lumpedModelSchema.parse((await engineer.patch(`${base()}/models/${model.id}`).send({ version: 1, stiffnessMatrixNPerM: stiffer }).expect(200)).body);
    expect(changed.version).toBe(2);
    const reference = referenceModes(massKg, stiffer);
    expect(relative(changed.modes[0].frequencyHz, reference[0].frequencyHz)).toBeLessThan(1e-9);
    const after = await getMode(mode.id);
    expect(relative(after.frequencyHz, reference[0].frequencyHz)).toBeLessThan(1e-9);
    expect(relative(after.modalMassKg, 1 / reference[0].phi[2] ** 2)).toBeLessThan(1e-9);
    expect(after.frequencyHz).not.toBeCloseTo(mode.frequencyHz, 3);
    // Its numbers changed, so its version moved on: a client holding the old one gets 409.
    expect(after.version).toBe(mode.version + 1);
    expectError((await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: mode.version, label: 'Stale' }).expect(409)).body, 'version_conflict');
    // A change of the name alone leaves the mode alone.
    await engineer.patch(`${base()}/models/${model.id}`).send({ version: 2, name: 'Renamed' }).expect(200);
    expect((await getMode(mode.id)).version).toBe(after.version);
  });

  it('a model change that removes a mode’s mode number or DOF is refused with 409 naming the mode; nothing changes', async () => {
    const model = await createModel({ name: 'Model to shrink', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM, dofLabels: ['a', 'b', 'c'] });
    const third = await createMode({ label: 'Third mode', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 3, dofIndex: 0 } });
    const [modelBefore] = await t.ctx.db.select().from(lumpedModels).where(eq(lumpedModels.id, model.id));
    const [modeBefore] = await t.ctx.db.select().from(structureModes).where(eq(structureModes.id, third.id));
    const smaller = {
      version: 1,
      massMatrixKg: [
        [3000, 0],
        [0, 2500],
      ],
      stiffnessMatrixNPerM: [
        [9e6, -4e6],
        [-4e6, 4e6],
      ],
      dofLabels: ['a', 'b'],
    };
    const response = await engineer.patch(`${base()}/models/${model.id}`).send(smaller).expect(409);
    const error = expectError(response.body, 'derived_mode_conflict');
    expect(error.issues.map((issue) => issue.path)).toEqual([`modes.${third.id}.source.modeNumber`]);
    expect(error.message).toContain('Third mode');
    const [modelAfter] = await t.ctx.db.select().from(lumpedModels).where(eq(lumpedModels.id, model.id));
    const [modeAfter] = await t.ctx.db.select().from(structureModes).where(eq(structureModes.id, third.id));
    expect(modelAfter).toEqual(modelBefore);
    expect(modeAfter).toEqual(modeBefore);
    // Stored DOF labels must follow a change of size.
    const unlabelled = await engineer.patch(`${base()}/models/${model.id}`).send({ ...smaller, dofLabels: undefined }).expect(400);
    expect(issuePaths(unlabelled.body)).toEqual(['dofLabels']);
  });

  it('a model change that puts a node at a mode’s DOF is refused with 409 naming the mode', async () => {
    // Three equal masses in a chain fixed at both ends: the second mode is antisymmetric, the middle DOF is its node
    // (textbook result for a symmetric chain). Unequal springs first, so that the middle DOF moves.
    const equalMass = [
      [1000, 0, 0],
      [0, 1000, 0],
      [0, 0, 1000],
    ];
    const chain = (left: number, right: number) => [
      [left + 1e6, -1e6, 0],
      [-1e6, 2e6, -1e6],
      [0, -1e6, right + 1e6],
    ];
    const model = await createModel({ name: 'Chain', massMatrixKg: equalMass, stiffnessMatrixNPerM: chain(1e6, 2e6) });
    const mode = await createMode({ label: 'Second chain mode', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 2, dofIndex: 1 } });
    const response = await engineer.patch(`${base()}/models/${model.id}`).send({ version: 1, stiffnessMatrixNPerM: chain(1e6, 1e6) }).expect(409);
    expect(issuePaths(response.body)).toEqual([`modes.${mode.id}.source.dofIndex`]);
    // And a new mode at that node is refused as bad input.
    const symmetric = await createModel({ name: 'Symmetric chain', massMatrixKg: equalMass, stiffnessMatrixNPerM: chain(1e6, 1e6) });
    const atNode = await engineer
      .post(`${base()}/modes`)
      .send({ label: 'At the node', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: symmetric.id, modeNumber: 2, dofIndex: 1 } })
      .expect(400);
    expect(issuePaths(atNode.body)).toEqual(['source.dofIndex']);
  });

  it('refuses a mode number, DOF or model the structure does not have, naming the source field', async () => {
    const model = await createModel({ name: 'Small model', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM });
    const source = { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 0 };
    const post = (s: Record<string, unknown>, extra: Record<string, unknown> = {}) =>
      engineer.post(`${base()}/modes`).send({ label: 'Refused', dampingRatio: 0.006, source: s, ...extra });
    expect(issuePaths((await post({ ...source, modeNumber: 4 }).expect(400)).body)).toEqual(['source.modeNumber']);
    expect(issuePaths((await post({ ...source, dofIndex: 3 }).expect(400)).body)).toEqual(['source.dofIndex']);
    expect(issuePaths((await post({ ...source, modeNumber: 0 }).expect(400)).body)).toEqual(['source.modeNumber']);
    const elsewhere = await createModel({ name: 'Other structure’s model', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM }, otherStructureId);
    expect(issuePaths((await post({ ...source, modelId: elsewhere.id }).expect(400)).body)).toEqual(['source.modelId']);
    expect(issuePaths((await post({ ...source, modelId: 'model-1' }).expect(400)).body)).toEqual(['source.modelId']);
    // An id in capitals names the same model (stored in lower case).
    const capitals = await createMode({ label: 'Capitals', dampingRatio: 0.006, source: { ...source, modelId: model.id.toUpperCase() } });
    expect(capitals.source).toEqual(source);
    await engineer.delete(`${base()}/modes/${capitals.id}`).expect(204);
    // The derived numbers are the server's: sending them is refused by name.
    expect(issuePaths((await post(source, { modalMassKg: 1000 }).expect(400)).body)).toEqual(['modalMassKg']);
    // A free-floating model's first mode is a rigid-body mode (0 Hz).
    const free = await createModel({
      name: 'Free pair',
      massMatrixKg: [
        [1000, 0],
        [0, 1000],
      ],
      stiffnessMatrixNPerM: [
        [1e6, -1e6],
        [-1e6, 1e6],
      ],
    });
    expect(issuePaths((await post({ ...source, modelId: free.id }).expect(400)).body)).toEqual(['source.modeNumber']);
  });

  it('deleting a model in use is refused with 409 naming the mode; once the mode is typed, the model can go', async () => {
    const model = await createModel({ name: 'Model in use', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM });
    const mode = await createMode({ label: 'Uses the model', dampingRatio: 0.006, modeShapeMean: 0.6, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 2 } });
    const refused = await engineer.delete(`${base()}/models/${model.id}`).expect(409);
    const error = expectError(refused.body, 'model_in_use');
    expect(error.message).toContain('Uses the model');
    expect(error.issues.map((issue) => issue.path)).toEqual([`modes.${mode.id}`]);
    await getModel(model.id);
    // Typing over a derived number needs the source changed first.
    expect(issuePaths((await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: 1, frequencyHz: 2.5 }).expect(400)).body)).toEqual(['frequencyHz']);
    const typed = savedModeSchema.parse((await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: 1, source: { kind: 'typed' } }).expect(200)).body);
    expect(typed).toMatchObject({ frequencyHz: mode.frequencyHz, modalMassKg: mode.modalMassKg, modeShapeMean: 0.6, source: { kind: 'typed' }, version: 2 });
    await engineer.delete(`${base()}/models/${model.id}`).expect(204);
    const retyped = savedModeSchema.parse((await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: 2, frequencyHz: 2.5 }).expect(200)).body);
    expect(retyped.frequencyHz).toBe(2.5);
  });
});

describe('a beam-derived mode', () => {
  const beam = { lengthM: 36, bendingStiffnessNM2: 4.2e9, massPerLengthKgPerM: 2100 };
  const root = Math.sqrt(beam.bendingStiffnessNM2 / beam.massPerLengthKgPerM);
  const beamMass = beam.massPerLengthKgPerM * beam.lengthM;

  it('simply supported: stores f = π/(2L²)·√(EI/m), modal mass mL/2 and mean |φ| = 2/π (handbook sine mode)', async () => {
    const mode = await createMode({ label: 'Beam, simply supported', dampingRatio: 0.005, source: { kind: 'beam', support: 'simply-supported', ...beam } });
    expect(relative(mode.frequencyHz, (Math.PI / (2 * beam.lengthM ** 2)) * root)).toBeLessThan(1e-12);
    expect(relative(mode.modalMassKg, beamMass / 2)).toBeLessThan(1e-9);
    expect(mode.modeShapeMean!).toBeCloseTo(2 / Math.PI, 6);
    expect(mode.source).toEqual({ kind: 'beam', support: 'simply-supported', ...beam, modeNumber: 1 });
    const [row] = await t.ctx.db.select().from(structureModes).where(eq(structureModes.id, mode.id));
    expect(row).toMatchObject({ frequencyHz: mode.frequencyHz, modalMassKg: mode.modalMassKg, modeShapeMean: mode.modeShapeMean, lumpedModelId: null });
  });

  it('fixed–fixed mode 1 and cantilever mode 2 match Blevins’ λ (4.73004, 4.69409) and modal masses 0.3965 mL, 0.25 mL (from memory)', async () => {
    const fixed = await createMode({ label: 'Beam, fixed', dampingRatio: 0.005, source: { kind: 'beam', support: 'fixed-fixed', ...beam } });
    expect(relative(fixed.frequencyHz, ((4.73004 ** 2) / (2 * Math.PI * beam.lengthM ** 2)) * root)).toBeLessThan(1e-5);
    expect(fixed.modalMassKg / beamMass).toBeCloseTo(0.3965, 3);
    const cantilever = await createMode({ label: 'Beam, cantilever', dampingRatio: 0.005, source: { kind: 'beam', support: 'cantilever', ...beam, modeNumber: 2 } });
    expect(relative(cantilever.frequencyHz, ((4.69409 ** 2) / (2 * Math.PI * beam.lengthM ** 2)) * root)).toBeLessThan(1e-5);
    expect(cantilever.modalMassKg / beamMass).toBeCloseTo(0.25, 6);
  });

  it('a beam whose numbers fall outside the engine’s ranges for a mode is refused, naming `source`', async () => {
    // A 0.1 m stiff rod: its first frequency is far above the 1000 Hz the engine accepts.
    const source = { kind: 'beam', support: 'cantilever', lengthM: 0.1, bendingStiffnessNM2: 1e9, massPerLengthKgPerM: 1 };
    const response = await engineer.post(`${base()}/modes`).send({ label: 'Rod', dampingRatio: 0.01, source }).expect(400);
    expect(issuePaths(response.body)).toEqual(['source']);
    expect(apiErrorSchema.parse(response.body).error.message).toContain('Hz');
  });

  it('is re-derived when its source changes; its derived numbers cannot be typed over while it stays derived', async () => {
    const mode = await createMode({ label: 'Beam to lengthen', dampingRatio: 0.005, source: { kind: 'beam', support: 'simply-supported', ...beam } });
    const longer = { kind: 'beam', support: 'simply-supported', ...beam, lengthM: 2 * beam.lengthM };
    const changed = savedModeSchema.parse((await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: 1, source: longer }).expect(200)).body);
    // f ∝ 1/L², modal mass ∝ L (handbook formula).
    expect(relative(changed.frequencyHz, mode.frequencyHz / 4)).toBeLessThan(1e-12);
    expect(relative(changed.modalMassKg, 2 * mode.modalMassKg)).toBeLessThan(1e-9);
    for (const field of ['frequencyHz', 'modalMassKg', 'modeShapeMean'] as const) {
      const response = await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: 2, [field]: 0.5 }).expect(400);
      expect(issuePaths(response.body)).toEqual([field]);
    }
    // Its own damping ratio and label stay the engineer's.
    const damped = savedModeSchema.parse((await engineer.patch(`${base()}/modes/${mode.id}`).send({ version: 2, dampingRatio: 0.008, label: 'Longer beam' }).expect(200)).body);
    expect(damped).toMatchObject({ dampingRatio: 0.008, label: 'Longer beam', frequencyHz: changed.frequencyHz, version: 3 });
  });
});
