/**
 * The structural model's routes (structures, modes, lumped models, load cases, comfort criteria) against a real
 * PostgreSQL: role × route, organisation and project scoping, optimistic concurrency, and bad input named by field.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { comfortCriteria, loadCases, lumpedModels, structureModes, structures } from '../../server/db/schema';
import { apiErrorSchema } from '../../shared/contracts/errors';
import {
  comfortCriteriaListSchema,
  comfortCriteriaSchema,
  loadCaseListSchema,
  lumpedModelListSchema,
  lumpedModelSchema,
  modeListSchema,
  savedLoadCaseSchema,
  savedModeSchema,
  structureListSchema,
  structureSchema,
} from '../../shared/contracts/model';
import { projectSchema } from '../../shared/contracts/projects';
import { roles, type Role } from '../../shared/contracts/roles';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;
const writers: Role[] = ['admin', 'engineer'];
const readers: Role[] = ['owner', 'fabricator', 'viewer'];

function expectError(body: unknown, code: string) {
  const parsed = apiErrorSchema.parse(body);
  expect(parsed.error.code).toBe(code);
  return parsed.error;
}
const issuePaths = (body: unknown) => apiErrorSchema.parse(body).error.issues.map((issue) => issue.path);

// Test inputs (not engineering values of any structure): small numbers that pass every rule.
const structureBody = { name: 'Test span', kind: 'footbridge-span', spanM: 40, widthM: 3, deckAreaM2: 120 };
const typedModeBody = { label: 'Test mode', direction: 'vertical', frequencyHz: 2, modalMassKg: 30_000, dampingRatio: 0.005 };
const modelBody = {
  name: 'Test two-mass model',
  massMatrixKg: [
    [2000, 0],
    [0, 1000],
  ],
  stiffnessMatrixNPerM: [
    [3e6, -1e6],
    [-1e6, 1e6],
  ],
  dofLabels: ['lower', 'upper'],
};
const loadCaseBody = { name: 'Test walker', spec: { kind: 'walker' } };
const criteriaBody = { name: 'Test limit', spec: { peakAccelerationLimitMPerS2: 0.7 } };

interface Ids {
  projectId: string;
  structureId: string;
  modeId: string;
  modelId: string;
  loadCaseId: string;
  criteriaId: string;
}

/** A project with one of everything, created through the API by `agent`. */
async function populate(agent: Agent, projectId: string): Promise<Ids> {
  const structureId = (await agent.post(`/api/projects/${projectId}/structures`).send(structureBody).expect(201)).body.id as string;
  const base = `/api/projects/${projectId}/structures/${structureId}`;
  const modeId = (await agent.post(`${base}/modes`).send(typedModeBody).expect(201)).body.id as string;
  const modelId = (await agent.post(`${base}/models`).send(modelBody).expect(201)).body.id as string;
  const loadCaseId = (await agent.post(`/api/projects/${projectId}/load-cases`).send(loadCaseBody).expect(201)).body.id as string;
  const criteriaId = (await agent.post(`/api/projects/${projectId}/comfort-criteria`).send(criteriaBody).expect(201)).body.id as string;
  return { projectId, structureId, modeId, modelId, loadCaseId, criteriaId };
}

let mine: Ids;
let sibling: Ids; // another project of the same organisation
let theirs: Ids; // organisation B

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
  const project = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Model test footbridge', kind: 'footbridge' }).expect(201)).body);
  const other = projectSchema.parse((await agents.engineer.post('/api/projects').send({ name: 'Sibling test floor', kind: 'floor' }).expect(201)).body);
  mine = await populate(agents.engineer, project.id);
  sibling = await populate(agents.engineer, other.id);
  theirs = await populate(outsiderAgent, t.outsiderProjectId);
});

afterAll(async () => {
  await t?.close();
});

interface Resource {
  name: string;
  collection: (ids: Ids) => string;
  item: (ids: Ids) => string;
  listKey: string;
  create: Record<string, unknown>;
  change: Record<string, unknown>;
  notFoundCode: string;
}

const resources: Resource[] = [
  {
    name: 'structures',
    collection: (ids) => `/api/projects/${ids.projectId}/structures`,
    item: (ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}`,
    listKey: 'structures',
    create: structureBody,
    change: { notes: 'Changed notes' },
    notFoundCode: 'structure_not_found',
  },
  {
    name: 'modes',
    collection: (ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}/modes`,
    item: (ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}/modes/${ids.modeId}`,
    listKey: 'modes',
    create: typedModeBody,
    change: { dampingRatio: 0.01 },
    notFoundCode: 'mode_not_found',
  },
  {
    name: 'models',
    collection: (ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}/models`,
    item: (ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}/models/${ids.modelId}`,
    listKey: 'models',
    create: modelBody,
    change: { name: 'Renamed model' },
    notFoundCode: 'model_not_found',
  },
  {
    name: 'load cases',
    collection: (ids) => `/api/projects/${ids.projectId}/load-cases`,
    item: (ids) => `/api/projects/${ids.projectId}/load-cases/${ids.loadCaseId}`,
    listKey: 'loadCases',
    create: loadCaseBody,
    change: { name: 'Renamed walker' },
    notFoundCode: 'load_case_not_found',
  },
  {
    name: 'comfort criteria',
    collection: (ids) => `/api/projects/${ids.projectId}/comfort-criteria`,
    item: (ids) => `/api/projects/${ids.projectId}/comfort-criteria/${ids.criteriaId}`,
    listKey: 'comfortCriteria',
    create: criteriaBody,
    change: { spec: { set: 'dg11', class: 'office' } },
    notFoundCode: 'comfort_criteria_not_found',
  },
];

const listSchemas = {
  structures: structureListSchema,
  modes: modeListSchema,
  models: lumpedModelListSchema,
  loadCases: loadCaseListSchema,
  comfortCriteria: comfortCriteriaListSchema,
} as const;

/** Every stored row of the five tables, to show that a refused request changed nothing. */
async function snapshot() {
  const db = t.ctx.db;
  return {
    structures: await db.select().from(structures),
    modes: await db.select().from(structureModes),
    models: await db.select().from(lumpedModels),
    loadCases: await db.select().from(loadCases),
    criteria: await db.select().from(comfortCriteria),
  };
}

describe('without a session', () => {
  it.each(resources)('$name: 401 on list and create', async (resource) => {
    expectError((await request(t.app).get(resource.collection(mine)).expect(401)).body, 'unauthenticated');
    expectError((await request(t.app).post(resource.collection(mine)).send(resource.create).expect(401)).body, 'unauthenticated');
  });
});

describe.each(resources)('$name: role × route', (resource) => {
  it.each(roles)('%s lists and reads (200), and the list holds only this project’s', async (role) => {
    const list = (await agents[role].get(resource.collection(mine)).expect(200)).body as Record<string, { id: string }[]>;
    listSchemas[resource.listKey as keyof typeof listSchemas].parse(list);
    const ids = list[resource.listKey].map((entry) => entry.id);
    expect(ids).toHaveLength(1);
    const item = (await agents[role].get(resource.item(mine)).expect(200)).body as { id: string; version: number; createdBy: string };
    expect(ids).toEqual([item.id]);
    expect(item.createdBy).toBe(t.people.engineer.id);
  });

  it.each(writers)('%s creates (201), changes at the version read (200, version + 1) and deletes (204)', async (role) => {
    const created = await agents[role].post(resource.collection(mine)).send(resource.create).expect(201);
    const thing = created.body as { id: string; version: number; createdBy: string; createdAt: string; updatedAt: string };
    expect(thing).toMatchObject({ version: 1, createdBy: t.people[role].id });
    expect(created.headers.location).toBe(`${resource.collection(mine)}/${thing.id}`);
    const changed = await agents[role].patch(`${resource.collection(mine)}/${thing.id}`).send({ version: 1, ...resource.change }).expect(200);
    expect(changed.body).toMatchObject({ ...resource.change, version: 2 });
    await agents[role].delete(`${resource.collection(mine)}/${thing.id}`).expect(204);
    expectError((await agents[role].get(`${resource.collection(mine)}/${thing.id}`).expect(404)).body, resource.notFoundCode);
  });

  it.each(readers)('%s may not create, change or delete (403), and nothing changes', async (role) => {
    const before = await snapshot();
    expectError((await agents[role].post(resource.collection(mine)).send(resource.create).expect(403)).body, 'forbidden');
    expectError((await agents[role].patch(resource.item(mine)).send({ version: 1, ...resource.change }).expect(403)).body, 'forbidden');
    expectError((await agents[role].delete(resource.item(mine)).expect(403)).body, 'forbidden');
    expect(await snapshot()).toEqual(before);
  });

  it.each(roles)('%s gets 404 for another organisation’s, by its own path or through a project of their own', async (role) => {
    const before = await snapshot();
    // Through organisation B's project: the project is not found.
    expectError((await agents[role].get(resource.collection(theirs)).expect(404)).body, 'project_not_found');
    expectError((await agents[role].get(resource.item(theirs)).expect(404)).body, 'project_not_found');
    // B's thing reached through A's own project (and structure): not found either.
    const smuggled: Ids = { ...theirs, projectId: mine.projectId, structureId: resource.name === 'structures' ? theirs.structureId : mine.structureId };
    expect((await agents[role].get(resource.item(smuggled)).expect(404)).body.error.code).toMatch(/_not_found$/);
    if (writers.includes(role)) {
      await agents[role].patch(resource.item(theirs)).send({ version: 1, ...resource.change }).expect(404);
      await agents[role].patch(resource.item(smuggled)).send({ version: 1, ...resource.change }).expect(404);
      await agents[role].delete(resource.item(theirs)).expect(404);
      await agents[role].delete(resource.item(smuggled)).expect(404);
      await agents[role].post(resource.collection(theirs)).send(resource.create).expect(404);
    }
    expect(await snapshot()).toEqual(before);
  });

  it('a thing of a sibling project (or structure) reached through another is 404 and stays unchanged', async () => {
    const before = await snapshot();
    const crossed: Ids = { ...sibling, projectId: mine.projectId, structureId: resource.name === 'structures' ? sibling.structureId : mine.structureId };
    expectError((await agents.engineer.get(resource.item(crossed)).expect(404)).body, resource.notFoundCode);
    expectError((await agents.engineer.patch(resource.item(crossed)).send({ version: 1, ...resource.change }).expect(404)).body, resource.notFoundCode);
    expectError((await agents.engineer.delete(resource.item(crossed)).expect(404)).body, resource.notFoundCode);
    if (resource.name === 'modes' || resource.name === 'models') {
      // The right project but another structure's mode or model.
      const otherStructure = (await agents.engineer.post(`/api/projects/${mine.projectId}/structures`).send({ name: 'Other span', kind: 'floor-bay' }).expect(201)).body.id;
      const viaOther: Ids = { ...mine, structureId: otherStructure };
      expectError((await agents.engineer.get(resource.item(viaOther)).expect(404)).body, resource.notFoundCode);
      await agents.engineer.delete(`/api/projects/${mine.projectId}/structures/${otherStructure}`).expect(204);
    }
    const after = await snapshot();
    expect(after).toEqual(before);
  });

  it('a stale version gets 409 version_conflict naming `version`, and nothing changes', async () => {
    const created = (await agents.engineer.post(resource.collection(mine)).send(resource.create).expect(201)).body as { id: string };
    const path = `${resource.collection(mine)}/${created.id}`;
    await agents.admin.patch(path).send({ version: 1, ...resource.change }).expect(200);
    const before = await snapshot();
    const response = await agents.engineer.patch(path).send({ version: 1, ...resource.change });
    expect(response.status).toBe(409);
    const error = expectError(response.body, 'version_conflict');
    expect(error.issues.map((issue) => issue.path)).toEqual(['version']);
    expect(await snapshot()).toEqual(before);
    await agents.engineer.delete(path).expect(204);
  });

  it('of simultaneous changes at the same version exactly one wins; the others get 409', async () => {
    const created = (await agents.engineer.post(resource.collection(mine)).send(resource.create).expect(201)).body as { id: string };
    const path = `${resource.collection(mine)}/${created.id}`;
    const attempts = await Promise.all([0, 1, 2, 3].map((i) => (i % 2 === 0 ? agents.engineer : agents.admin).patch(path).send({ version: 1, ...resource.change })));
    expect(attempts.map((response) => response.status).sort()).toEqual([200, 409, 409, 409]);
    expect(((await agents.engineer.get(path).expect(200)).body as { version: number }).version).toBe(2);
    await agents.engineer.delete(path).expect(204);
  });

  it('a PATCH without a version names `version`; one with nothing to change is refused', async () => {
    expect(issuePaths((await agents.engineer.patch(resource.item(mine)).send(resource.change).expect(400)).body)).toEqual(['version']);
    const current = (await agents.engineer.get(resource.item(mine)).expect(200)).body as { version: number };
    await agents.engineer.patch(resource.item(mine)).send({ version: current.version }).expect(400);
  });

  it('unknown fields are refused, named by their path', async () => {
    const response = await agents.engineer.post(resource.collection(mine)).send({ ...resource.create, colour: 'red' }).expect(400);
    expect(issuePaths(response.body)).toEqual(['colour']);
  });

  it('malformed ids in the path get 400 naming the parameter, never 500', async () => {
    const bad = 'not-a-uuid';
    expect(issuePaths((await agents.viewer.get(resource.collection({ ...mine, projectId: bad })).expect(400)).body)).toEqual(['projectId']);
    const itemParam = { structures: 'structureId', modes: 'modeId', models: 'modelId', 'load cases': 'loadCaseId', 'comfort criteria': 'criteriaId' }[resource.name]!;
    expect(issuePaths((await agents.viewer.get(resource.item({ ...mine, [itemParam]: bad })).expect(400)).body)).toEqual([itemParam]);
    if (resource.name === 'modes' || resource.name === 'models') {
      expect(issuePaths((await agents.viewer.get(resource.collection({ ...mine, structureId: bad })).expect(400)).body)).toEqual(['structureId']);
    }
    // A well-formed id of nothing is 404.
    const nothing = '00000000-0000-4000-8000-000000000000';
    expectError((await agents.viewer.get(resource.item({ ...mine, [itemParam]: nothing })).expect(404)).body, resource.notFoundCode);
  });
});

describe('bad input names the field at its path', () => {
  const modes = () => `/api/projects/${mine.projectId}/structures/${mine.structureId}/modes`;

  it('dampingRatio out of [0, 1) and an unknown direction', async () => {
    const before = await snapshot();
    const damping = await agents.engineer.post(modes()).send({ ...typedModeBody, dampingRatio: 1 }).expect(400);
    expect(issuePaths(damping.body)).toEqual(['dampingRatio']);
    const direction = await agents.engineer.post(modes()).send({ ...typedModeBody, direction: 'diagonal' }).expect(400);
    expect(issuePaths(direction.body)).toEqual(['direction']);
    const patch = await agents.engineer.patch(`${modes()}/${mine.modeId}`).send({ version: 1, dampingRatio: -0.01 }).expect(400);
    expect(issuePaths(patch.body)).toEqual(['dampingRatio']);
    expect(await snapshot()).toEqual(before);
  });

  it('a typed mode needs frequencyHz and modalMassKg', async () => {
    const response = await agents.engineer.post(modes()).send({ label: 'Bare', dampingRatio: 0.01 }).expect(400);
    expect(issuePaths(response.body).sort()).toEqual(['frequencyHz', 'modalMassKg']);
  });

  it('a beam source names source.lengthM; numbers sent with a derived source are refused by name', async () => {
    const beam = { kind: 'beam', support: 'simply-supported', lengthM: -30, bendingStiffnessNM2: 1e9, massPerLengthKgPerM: 1000 };
    const length = await agents.engineer.post(modes()).send({ label: 'Beam', dampingRatio: 0.005, source: beam }).expect(400);
    expect(issuePaths(length.body)).toEqual(['source.lengthM']);
    const sent = await agents.engineer
      .post(modes())
      .send({ label: 'Beam', dampingRatio: 0.005, frequencyHz: 2, modeShapeMean: 0.5, source: { ...beam, lengthM: 30 } })
      .expect(400);
    expect(issuePaths(sent.body).sort()).toEqual(['frequencyHz', 'modeShapeMean']);
    const unknownSupport = await agents.engineer.post(modes()).send({ label: 'Beam', dampingRatio: 0.005, source: { ...beam, lengthM: 30, support: 'hinged' } }).expect(400);
    expect(issuePaths(unknownSupport.body)).toEqual(['source.support']);
  });

  it('a load case spec names spec.deckAreaM2 (the engine’s loadCase rules), and a crowd needs a density or a class', async () => {
    const path = `/api/projects/${mine.projectId}/load-cases`;
    const crowd = { kind: 'crowd', guide: 'hivoss', trafficClass: 'TC2', deckAreaM2: 0 };
    expect(issuePaths((await agents.engineer.post(path).send({ name: 'Crowd', spec: crowd }).expect(400)).body)).toEqual(['spec.deckAreaM2']);
    const neither = { kind: 'crowd', guide: 'hivoss', deckAreaM2: 120 };
    expect(issuePaths((await agents.engineer.post(path).send({ name: 'Crowd', spec: neither }).expect(400)).body)).toEqual(['spec.densityPerM2']);
    const wrongClass = { kind: 'crowd', guide: 'setra', trafficClass: 'TC2', deckAreaM2: 120 };
    expect(issuePaths((await agents.engineer.post(path).send({ name: 'Crowd', spec: wrongClass }).expect(400)).body)).toEqual(['spec.trafficClass']);
    expect(issuePaths((await agents.engineer.post(path).send({ name: 'Crowd', spec: { kind: 'stampede' } }).expect(400)).body)).toEqual(['spec.kind']);
    const patch = await agents.engineer.patch(`${path}/${mine.loadCaseId}`).send({ version: 1, spec: { ...crowd, deckAreaM2: -1 } }).expect(400);
    expect(issuePaths(patch.body)).toEqual(['spec.deckAreaM2']);
  });

  it('a load case of every engine kind is stored as the engine parsed it', async () => {
    const path = `/api/projects/${mine.projectId}/load-cases`;
    const specs = [
      { kind: 'harmonic', modalForceAmplitudeN: 200, pacingRangeHz: [1.6, 2.4] },
      { kind: 'walker' },
      { kind: 'jogger', bodyWeightN: 750 },
      { kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 120 },
      { kind: 'lateral', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 120 },
      { kind: 'floor-walking' },
      { kind: 'moving-walker', spanM: 40 },
    ];
    for (const spec of specs) {
      const saved = savedLoadCaseSchema.parse((await agents.engineer.post(path).send({ name: `Every kind: ${spec.kind}`, spec }).expect(201)).body);
      expect(saved.spec).toMatchObject(spec);
      await agents.engineer.delete(`${path}/${saved.id}`).expect(204);
    }
  });

  it('comfort criteria: the engine’s criteria rules; status is not the client’s to set', async () => {
    const path = `/api/projects/${mine.projectId}/comfort-criteria`;
    const created = comfortCriteriaSchema.parse((await agents.engineer.post(path).send({ name: 'Guide class', spec: { set: 'hivoss', class: 'CL2' } }).expect(201)).body);
    expect(created.status).toBe('draft');
    expect(issuePaths((await agents.engineer.post(path).send({ ...criteriaBody, status: 'approved' }).expect(400)).body)).toEqual(['status']);
    expect(issuePaths((await agents.engineer.patch(`${path}/${created.id}`).send({ version: 1, status: 'approved' }).expect(400)).body)).toEqual(['status']);
    expect(issuePaths((await agents.engineer.post(path).send({ name: 'Bad', spec: { set: 'hivoss', class: 'CL9' } }).expect(400)).body)).toEqual(['spec.class']);
    expect(issuePaths((await agents.engineer.post(path).send({ name: 'Bad', spec: { peakAccelerationLimitMPerS2: 0 } }).expect(400)).body)).toEqual([
      'spec.peakAccelerationLimitMPerS2',
    ]);
    const [row] = await t.ctx.db.select().from(comfortCriteria).where(eq(comfortCriteria.id, created.id));
    expect(row.status).toBe('draft');
  });

  it('lumped-model matrices: stiffnessMatrixNPerM not symmetric, not square, or sized unlike the mass; dofLabels one per DOF', async () => {
    const path = `/api/projects/${mine.projectId}/structures/${mine.structureId}/models`;
    const before = await snapshot();
    const asymmetric = { ...modelBody, stiffnessMatrixNPerM: [[3e6, -1e6], [-2e6, 1e6]] };
    expect(issuePaths((await agents.engineer.post(path).send(asymmetric).expect(400)).body)).toEqual(['stiffnessMatrixNPerM.1.0']);
    const ragged = { ...modelBody, stiffnessMatrixNPerM: [[3e6, -1e6], [-1e6]] };
    expect(issuePaths((await agents.engineer.post(path).send(ragged).expect(400)).body)).toEqual(['stiffnessMatrixNPerM.1']);
    const sized = { ...modelBody, stiffnessMatrixNPerM: [[1e6]] };
    expect(issuePaths((await agents.engineer.post(path).send(sized).expect(400)).body)).toEqual(['stiffnessMatrixNPerM']);
    const text = { ...modelBody, stiffnessMatrixNPerM: 'stiff' };
    expect(issuePaths((await agents.engineer.post(path).send(text).expect(400)).body)).toEqual(['stiffnessMatrixNPerM']);
    const labels = { ...modelBody, dofLabels: ['only one'] };
    expect(issuePaths((await agents.engineer.post(path).send(labels).expect(400)).body)).toEqual(['dofLabels']);
    // Symmetric with a positive diagonal but not positive definite: the engine's factorisation refuses it.
    const indefinite = { ...modelBody, massMatrixKg: [[1000, 2000], [2000, 1000]] };
    expect(issuePaths((await agents.engineer.post(path).send(indefinite).expect(400)).body)).toEqual(['massMatrixKg']);
    // A PATCH is checked with the stored other matrix: a 3×3 stiffness against the stored 2×2 mass.
    const patch = await agents.engineer
      .patch(`${path}/${mine.modelId}`)
      .send({ version: 1, stiffnessMatrixNPerM: [[1, 0, 0], [0, 1, 0], [0, 0, 1]] })
      .expect(400);
    expect(issuePaths(patch.body)).toEqual(['stiffnessMatrixNPerM']);
    expect(await snapshot()).toEqual(before);
  });

  it('structures: dimensions must be positive, kind one of the two', async () => {
    const path = `/api/projects/${mine.projectId}/structures`;
    expect(issuePaths((await agents.engineer.post(path).send({ ...structureBody, deckAreaM2: -5 }).expect(400)).body)).toEqual(['deckAreaM2']);
    expect(issuePaths((await agents.engineer.post(path).send({ ...structureBody, kind: 'tower' }).expect(400)).body)).toEqual(['kind']);
  });
});

describe('answers', () => {
  it('parse with the contracts the client uses', async () => {
    structureSchema.parse((await agents.viewer.get(resources[0].item(mine)).expect(200)).body);
    savedModeSchema.parse((await agents.viewer.get(resources[1].item(mine)).expect(200)).body);
    const model = lumpedModelSchema.parse((await agents.viewer.get(resources[2].item(mine)).expect(200)).body);
    expect(model.modes).toHaveLength(2);
    savedLoadCaseSchema.parse((await agents.viewer.get(resources[3].item(mine)).expect(200)).body);
    comfortCriteriaSchema.parse((await agents.viewer.get(resources[4].item(mine)).expect(200)).body);
  });

  it('deleting a structure removes its modes and models', async () => {
    const extra = await populate(agents.admin, mine.projectId);
    await agents.admin.delete(`/api/projects/${mine.projectId}/structures/${extra.structureId}`).expect(204);
    expect(await t.ctx.db.select().from(structureModes).where(eq(structureModes.structureId, extra.structureId))).toEqual([]);
    expect(await t.ctx.db.select().from(lumpedModels).where(eq(lumpedModels.structureId, extra.structureId))).toEqual([]);
    await agents.admin.delete(`/api/projects/${mine.projectId}/load-cases/${extra.loadCaseId}`).expect(204);
    await agents.admin.delete(`/api/projects/${mine.projectId}/comfort-criteria/${extra.criteriaId}`).expect(204);
  });
});
