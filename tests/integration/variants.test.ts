/**
 * Tuning variants against a real PostgreSQL: stored numbers equal to the `assess` command's on the same request, a
 * result that follows a changed mode, `size` meeting the limit at both edges of the detuning band, role × route,
 * organisation and project scoping, bad input named by field, deleting what a variant uses, display preferences.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { variantCurvesSchema, variantListSchema, variantSchema, variantSizeSchema, type Variant } from '../../shared/contracts/variants';
import { preferencesSchema } from '../../shared/contracts/preferences';
import { assessResponseSchema } from '../../shared/contracts/compute-design';
import { projectSchema } from '../../shared/contracts/projects';
import { roles, type Role } from '../../shared/contracts/roles';
import { createTestVariant, populateTestDesign, testVariantBody, testCriteriaSpec, testCrowdSpec, testMode, testWalkerSpec, type TestDesignIds } from '../support/design-fixture';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;
const readers: Role[] = ['owner', 'fabricator', 'viewer'];

const issuePaths = (body: unknown) => apiErrorSchema.parse(body).error.issues.map((issue) => issue.path);

// Test inputs (invented, not the values of any structure).
// The design of tests/support/design-fixture.ts (invented).
const mode = testMode;
const crowdSpec = testCrowdSpec;
const walkerSpec = testWalkerSpec;
const criteriaSpec = testCriteriaSpec;

type Ids = TestDesignIds;
const populate = (agent: Agent, projectId: string): Promise<Ids> => populateTestDesign(agent, projectId);

let mine: Ids;
let sibling: Ids;
let theirs: Ids;
const variantsOf = (ids: Ids) => `/api/projects/${ids.projectId}/variants`;
const modeUrl = (ids: Ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}/modes/${ids.modeId}`;

/** The fixture's variant with two units. */
const variantBody = (ids: Ids, over: Record<string, unknown> = {}) => testVariantBody(ids, { unitCount: 2, ...over });
const create = (ids: Ids, over: Record<string, unknown> = {}): Promise<Variant> => createTestVariant(agents.engineer, ids, { unitCount: 2, ...over });

/** POST /api/compute/assess: the same command as `calc assess`. */
async function assess(body: Record<string, unknown>) {
  const response = await agents.viewer.post('/api/compute/assess').send(body);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return assessResponseSchema.parse(response.body);
}

function assessBody(m: { frequencyHz: number; modalMassKg: number; dampingRatio: number }, tmd: unknown, spec: Record<string, unknown>, hardware?: unknown) {
  return {
    structure: { modalMassKg: m.modalMassKg, frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio, direction: 'vertical' },
    tmds: [tmd],
    // A crowd load case that gives no mean |φ| takes the mode's.
    loadCase: spec.kind === 'crowd' ? { ...spec, modeShapeMean: 0.6 } : spec,
    criteria: criteriaSpec,
    ...(hardware ? { hardware } : {}),
  };
}

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
  const project = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Variant test footbridge', kind: 'footbridge' }).expect(201)).body);
  const other = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Variant sibling', kind: 'footbridge' }).expect(201)).body);
  mine = await populate(agents.engineer, project.id);
  sibling = await populate(agents.engineer, other.id);
  theirs = await populate(outsiderAgent, t.outsiderProjectId);
});

afterAll(async () => {
  await t?.close();
});

describe('a variant’s result', () => {
  it('stores, for each load case, the numbers of the assess command on the same inputs', async () => {
    const variant = await create(mine);
    const result = variant.result;
    expect(result).not.toBeNull();
    if (!result) return;
    expect(result.stale).toBe(false);
    expect(result.inputsHash).toMatch(/^[0-9a-f]{64}$/);
    expect(result.loadCases.map((lc) => lc.loadCaseId)).toEqual([mine.crowdId, mine.walkerId]);
    for (const [i, spec] of [crowdSpec, walkerSpec].entries()) {
      const answer = await assess(assessBody(mode, result.tmd, spec, { unitCount: 2 }));
      const stored = result.loadCases[i];
      expect(stored.peakAccelerationMPerS2).toBe(answer.peakAccelerationMPerS2);
      expect(stored.bareStructurePeakAccelerationMPerS2).toBe(answer.bareStructurePeakAccelerationMPerS2);
      expect(stored.tmdStrokeM).toEqual(answer.tmdStrokeM);
      expect(stored.utilisation).toBe(answer.utilisation);
      expect(stored.verdict).toBe(answer.verdict);
      expect(stored.comfortClass).toBe(answer.comfortClass);
      expect(stored.hardware).toEqual(answer.hardware);
    }
    const governing = result.loadCases.reduce((a, b) => ((b.utilisation ?? 0) > (a.utilisation ?? 0) ? b : a));
    expect(result.governing).toEqual({
      loadCaseId: governing.loadCaseId,
      peakAccelerationMPerS2: governing.peakAccelerationMPerS2,
      utilisation: governing.utilisation,
      verdict: (governing.utilisation ?? 0) <= 1 ? 'pass' : 'fail',
    });
    expect(result.detuning.worstUtilisation).toBeGreaterThanOrEqual(result.governing.utilisation);
  });

  it('tunes a Den Hartog damper to f_s/(1+μ) with ζ_a = √(3μ/(8(1+μ))) referred to its own frequency', async () => {
    // Den Hartog, Mechanical Vibrations, 4th ed. (1956): optimum damper on an undamped primary under a harmonic force.
    const mu = 0.03;
    const variant = await create(mine, { name: 'Test Den Hartog 3 %', massRatio: mu });
    expect(variant.result?.tmd.massKg).toBeCloseTo(mu * 30_000, 9);
    expect(variant.result?.tmd.frequencyHz).toBeCloseTo(2.0 / (1 + mu), 12);
    expect(variant.result?.tmd.dampingRatio).toBeCloseTo(Math.sqrt((3 * mu) / (8 * (1 + mu))), 12);
  });

  it('follows a changed mode: re-tuned by method, kept when tuned by hand, never served stale', async () => {
    const ids = await populate(agents.engineer, (await agents.engineer.post('/api/projects').send({ name: 'Variant mode change', kind: 'footbridge' }).expect(201)).body.id);
    const byMethod = await create(ids);
    const manual = await create(ids, { name: 'Test manual', tuning: { frequencyHz: 1.95, dampingRatio: 0.08 } });
    const modeRow = (await agents.engineer.get(modeUrl(ids)).expect(200)).body as { version: number };
    await agents.engineer.patch(modeUrl(ids)).send({ version: modeRow.version, frequencyHz: 2.2 }).expect(200);

    const again = variantSchema.parse((await agents.viewer.get(`${variantsOf(ids)}/${byMethod.id}`).expect(200)).body);
    expect(again.version).toBe(byMethod.version);
    expect(again.result?.inputsHash).not.toBe(byMethod.result?.inputsHash);
    expect(again.result?.tmd.frequencyHz).toBeCloseTo(2.2 / 1.02, 12);
    const answer = await assess(assessBody({ ...mode, frequencyHz: 2.2 }, again.result?.tmd, crowdSpec, { unitCount: 2 }));
    expect(again.result?.loadCases[0].peakAccelerationMPerS2).toBe(answer.peakAccelerationMPerS2);

    const list = variantListSchema.parse((await agents.viewer.get(variantsOf(ids)).expect(200)).body);
    const manualAgain = list.variants.find((v) => v.id === manual.id);
    expect(manualAgain?.result?.tmd).toEqual({ massKg: 600, frequencyHz: 1.95, dampingRatio: 0.08 });
    const manualAnswer = await assess(assessBody({ ...mode, frequencyHz: 2.2 }, manualAgain?.result?.tmd, walkerSpec, { unitCount: 2 }));
    expect(manualAgain?.result?.loadCases[1].peakAccelerationMPerS2).toBe(manualAnswer.peakAccelerationMPerS2);

    // A changed load case and criteria are followed too.
    const lc = (await agents.engineer.get(`/api/projects/${ids.projectId}/load-cases/${ids.walkerId}`).expect(200)).body as { version: number };
    await agents.engineer.patch(`/api/projects/${ids.projectId}/load-cases/${ids.walkerId}`).send({ version: lc.version, name: 'Renamed walker' }).expect(200);
    const cr = (await agents.engineer.get(`/api/projects/${ids.projectId}/comfort-criteria/${ids.criteriaId}`).expect(200)).body as { version: number };
    await agents.engineer.patch(`/api/projects/${ids.projectId}/comfort-criteria/${ids.criteriaId}`).send({ version: cr.version, spec: { set: 'setra', class: 'mean' } }).expect(200);
    const third = variantSchema.parse((await agents.viewer.get(`${variantsOf(ids)}/${byMethod.id}`).expect(200)).body);
    expect(third.result?.loadCases[1].name).toBe('Renamed walker');
    expect(third.result?.loadCases[0].criterion?.limitMPerS2).toBe(1.0);
  });

  it('answers a change with the recomputed result and refuses a stale version', async () => {
    const variant = await create(mine, { name: 'Test change' });
    const changed = variantSchema.parse((await agents.engineer.patch(`${variantsOf(mine)}/${variant.id}`).send({ version: variant.version, massRatio: 0.04 }).expect(200)).body);
    expect(changed.version).toBe(variant.version + 1);
    expect(changed.result?.tmd.massKg).toBeCloseTo(1200, 9);
    const stale = await agents.engineer.patch(`${variantsOf(mine)}/${variant.id}`).send({ version: variant.version, massRatio: 0.05 });
    expect(stale.status).toBe(409);
    expect(apiErrorSchema.parse(stale.body).error.code).toBe('version_conflict');
  });
});

describe('size', () => {
  it('finds a mass ratio that meets the limit at both edges of the detuning band on every load case, and applies it on request', async () => {
    const variant = await create(mine, { name: 'Test to size', tuning: { method: 'hinf' }, structureFrequencyToleranceRatio: 0.1 });
    const url = `${variantsOf(mine)}/${variant.id}/size`;
    const sized = variantSizeSchema.parse((await agents.engineer.post(url).send({}).expect(200)).body);
    expect(sized.applied).toBe(false);
    expect(sized.massRatio).toBeGreaterThan(0);
    expect(sized.worstUtilisation).toBeLessThanOrEqual(1);
    for (const factor of [0.9, 1.1]) {
      for (const spec of [crowdSpec, walkerSpec]) {
        const answer = await assess(assessBody({ ...mode, frequencyHz: 2.0 * factor }, sized.tmd, spec));
        expect(answer.utilisation).toBeLessThanOrEqual(1);
      }
    }
    const unchanged = variantSchema.parse((await agents.viewer.get(`${variantsOf(mine)}/${variant.id}`).expect(200)).body);
    expect(unchanged.massRatio).toBe(0.02);

    expect(issuePaths((await agents.engineer.post(url).send({ apply: true }).expect(400)).body)).toEqual(['version']);
    const applied = variantSizeSchema.parse((await agents.engineer.post(url).send({ apply: true, version: variant.version }).expect(200)).body);
    expect(applied.applied).toBe(true);
    expect(applied.variant?.massRatio).toBe(sized.massRatio);
    expect(applied.variant?.result?.detuning.worstUtilisation).toBeLessThanOrEqual(1);
    await agents.engineer.post(url).send({ apply: true, version: variant.version }).expect(409);
  });

  it('is refused for a variant tuned by hand, naming tuning', async () => {
    const manual = await create(mine, { name: 'Test manual size', tuning: { frequencyHz: 1.96, dampingRatio: 0.07 } });
    const response = await agents.engineer.post(`${variantsOf(mine)}/${manual.id}/size`).send({}).expect(400);
    expect(issuePaths(response.body)).toEqual(['tuning']);
  });
});

describe('curves', () => {
  it('gives the response over the load band with its peak equal to the stored one, and the robustness map', async () => {
    const variant = await create(mine, { name: 'Test curves' });
    const curves = variantCurvesSchema.parse((await agents.viewer.get(`${variantsOf(mine)}/${variant.id}/curves`).query({ loadCaseId: mine.crowdId }).expect(200)).body);
    const top = Math.max(...curves.response.flatMap((b) => b.accelerationMPerS2));
    expect(top).toBeCloseTo(variant.result?.loadCases[0].peakAccelerationMPerS2 ?? NaN, 9);
    expect(curves.robustness?.structureFrequencyHz.length).toBeGreaterThan(10);
    const other = await agents.viewer.get(`${variantsOf(mine)}/${variant.id}/curves`).query({ loadCaseId: sibling.crowdId }).expect(400);
    expect(issuePaths(other.body)).toEqual(['loadCaseId']);
  });
});

describe('access', () => {
  let variant: Variant;
  beforeAll(async () => {
    variant = await create(mine, { name: 'Test access' });
  });

  it('lets every role of the organisation read, and only admins and engineers change', async () => {
    for (const role of roles) {
      await agents[role].get(variantsOf(mine)).expect(200);
      await agents[role].get(`${variantsOf(mine)}/${variant.id}`).expect(200);
      await agents[role].get(`${variantsOf(mine)}/${variant.id}/curves`).query({ loadCaseId: mine.walkerId }).expect(200);
    }
    for (const role of readers) {
      await agents[role].post(variantsOf(mine)).send(variantBody(mine)).expect(403);
      await agents[role].patch(`${variantsOf(mine)}/${variant.id}`).send({ version: variant.version, name: 'x' }).expect(403);
      await agents[role].delete(`${variantsOf(mine)}/${variant.id}`).expect(403);
      await agents[role].post(`${variantsOf(mine)}/${variant.id}/size`).send({}).expect(403);
    }
    const byAdmin = await agents.admin.post(variantsOf(mine)).send(variantBody(mine, { name: 'Test by admin' })).expect(201);
    await agents.admin.delete(`${variantsOf(mine)}/${byAdmin.body.id as string}`).expect(204);
    await agents.admin.get(`${variantsOf(mine)}/${byAdmin.body.id as string}`).expect(404);
    await request(t.app).get(variantsOf(mine)).expect(401);
  });

  it('hides another organisation’s variants and projects (404), and a variant under another project’s path', async () => {
    const theirVariant = (await outsiderAgent.post(variantsOf(theirs)).send(variantBody(theirs)).expect(201)).body as { id: string };
    await agents.engineer.get(`${variantsOf(theirs)}/${theirVariant.id}`).expect(404);
    await agents.engineer.get(variantsOf(theirs)).expect(404);
    await agents.engineer.patch(`${variantsOf(theirs)}/${theirVariant.id}`).send({ version: 1, name: 'x' }).expect(404);
    await agents.engineer.delete(`${variantsOf(theirs)}/${theirVariant.id}`).expect(404);
    await outsiderAgent.get(`${variantsOf(mine)}/${variant.id}`).expect(404);
    await agents.engineer.get(`${variantsOf(sibling)}/${variant.id}`).expect(404);
    await agents.engineer.get(`${variantsOf(mine)}/not-a-uuid`).expect(400);
  });
});

describe('bad input', () => {
  it('names the field and the rule', async () => {
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ massRatio: 0 }, 'massRatio'],
      [{ massRatio: 0.3 }, 'massRatio'],
      [{ modeId: sibling.modeId }, 'modeId'],
      [{ modeId: theirs.modeId }, 'modeId'],
      [{ loadCaseIds: [sibling.crowdId] }, 'loadCaseIds.0'],
      [{ loadCaseIds: [mine.crowdId, theirs.walkerId] }, 'loadCaseIds.1'],
      [{ loadCaseIds: [] }, 'loadCaseIds'],
      [{ criteriaId: sibling.criteriaId }, 'criteriaId'],
      [{ tuning: { method: 'best' } }, 'tuning'],
      [{ tuning: { frequencyHz: 1.9, dampingRatio: 0 } }, 'tuning.dampingRatio'],
      [{ unitCount: 0 }, 'unitCount'],
      [{ structureFrequencyToleranceRatio: 0.6 }, 'structureFrequencyToleranceRatio'],
      [{ hardware: { unitCount: 2 } }, 'hardware.unitCount'],
    ];
    for (const [over, path] of cases) {
      const response = await agents.engineer.post(variantsOf(mine)).send(variantBody(mine, over));
      expect(response.status, `${JSON.stringify(over)}: ${JSON.stringify(response.body)}`).toBe(400);
      expect(issuePaths(response.body)).toContain(path);
    }
    const before = variantListSchema.parse((await agents.viewer.get(variantsOf(mine)).expect(200)).body).variants.length;
    const variant = await create(mine, { name: 'Test bad patch' });
    const response = await agents.engineer.patch(`${variantsOf(mine)}/${variant.id}`).send({ version: variant.version, modeId: sibling.modeId }).expect(400);
    expect(issuePaths(response.body)).toEqual(['modeId']);
    const after = variantSchema.parse((await agents.viewer.get(`${variantsOf(mine)}/${variant.id}`).expect(200)).body);
    expect(after.version).toBe(variant.version);
    expect(variantListSchema.parse((await agents.viewer.get(variantsOf(mine)).expect(200)).body).variants.length).toBe(before + 1);
  });

  it('names the load case when the engine refuses it for the mode', async () => {
    const lateral = (await agents.engineer
      .post(`/api/projects/${mine.projectId}/load-cases`)
      .send({ name: 'Test lateral crowd', spec: { kind: 'lateral', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 120 } })
      .expect(201)).body.id as string;
    const response = await agents.engineer.post(variantsOf(mine)).send(variantBody(mine, { loadCaseIds: [mine.walkerId, lateral] })).expect(400);
    expect(issuePaths(response.body)).toContain('modeId');
  });
});

describe('deleting what a variant uses', () => {
  it('is refused with 409 naming the variant, for a mode, a load case, criteria and a structure', async () => {
    const ids = await populate(agents.engineer, (await agents.engineer.post('/api/projects').send({ name: 'Variant delete', kind: 'footbridge' }).expect(201)).body.id);
    const variant = await create(ids, { name: 'Test keeps them' });
    for (const url of [
      modeUrl(ids),
      `/api/projects/${ids.projectId}/load-cases/${ids.walkerId}`,
      `/api/projects/${ids.projectId}/comfort-criteria/${ids.criteriaId}`,
      `/api/projects/${ids.projectId}/structures/${ids.structureId}`,
    ]) {
      const response = await agents.engineer.delete(url).expect(409);
      const error = apiErrorSchema.parse(response.body).error;
      expect(error.code).toBe('in_use_by_variants');
      expect(error.message).toContain('Test keeps them');
    }
    await agents.engineer.get(modeUrl(ids)).expect(200);
    await agents.engineer.delete(`${variantsOf(ids)}/${variant.id}`).expect(204);
    await agents.engineer.delete(modeUrl(ids)).expect(204);
    // The project itself may go, variants and all.
    const other = await populate(agents.engineer, (await agents.engineer.post('/api/projects').send({ name: 'Variant project delete', kind: 'footbridge' }).expect(201)).body.id);
    await create(other);
    await agents.engineer.delete(`/api/projects/${other.projectId}`).expect(204);
  });
});

describe('display preferences', () => {
  it('default to SI, change per person, and refuse an unknown system by name', async () => {
    expect(preferencesSchema.parse((await agents.viewer.get('/api/me/preferences').expect(200)).body)).toEqual({ unitSystem: 'si' });
    expect((await agents.viewer.patch('/api/me/preferences').send({ unitSystem: 'us-customary' }).expect(200)).body).toEqual({ unitSystem: 'us-customary' });
    expect((await agents.viewer.get('/api/me/preferences').expect(200)).body).toEqual({ unitSystem: 'us-customary' });
    expect((await agents.engineer.get('/api/me/preferences').expect(200)).body).toEqual({ unitSystem: 'si' });
    expect(issuePaths((await agents.viewer.patch('/api/me/preferences').send({ unitSystem: 'imperial' }).expect(400)).body)).toEqual(['unitSystem']);
    await request(t.app).get('/api/me/preferences').expect(401);
  });
});
