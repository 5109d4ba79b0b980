/**
 * The project's history against a real PostgreSQL: an entry for every kind of change (written by the database's
 * triggers in the transaction of the change), the person who made it, the values before and after; nothing for a
 * refused change or for a read that recomputes a variant's result; paging, filters, and who may read it.
 * The footbridge numbers below are invented test inputs, not the values of any structure.
 */
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { historyListSchema, type HistoryEvent, type HistoryList } from '../../shared/contracts/history';
import type { Variant } from '../../shared/contracts/variants';
import { roles, type Role } from '../../shared/contracts/roles';
import { demoSiteRecordCsv, demoSiteRecords } from '../../server/db/seed';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';
import { createTestVariant, newTestDesignProject, testCrowdSpec, testWalkerSpec, type TestDesignIds } from '../support/design-fixture';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;

// Test inputs (invented).
// Test inputs (invented): the design of tests/support/design-fixture.ts, with a lighter crowd.
const crowdSpec = { ...testCrowdSpec, densityPerM2: 0.5 };
const walkerSpec = testWalkerSpec;
const massKg = [
  [3000, 200],
  [200, 2500],
];
const stiffnessNPerM = [
  [9e6, -4e6],
  [-4e6, 7e6],
];

type Ids = TestDesignIds;
const newProject = (name: string): Promise<Ids> => newTestDesignProject(agents.engineer, name, { crowdSpec });
/** A variant on the crowd alone unless `over` says otherwise. */
const createVariant = (ids: Ids, over: Record<string, unknown> = {}, agent = agents.engineer): Promise<Variant> =>
  createTestVariant(agent, ids, { loadCaseIds: [ids.crowdId], ...over });

async function history(ids: { projectId: string }, query: Record<string, string | number> = {}, agent = agents.viewer): Promise<HistoryList> {
  const response = await agent.get(`/api/projects/${ids.projectId}/history`).query(query);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return historyListSchema.parse(response.body);
}

/** The newest entry about one thing. */
async function latest(ids: { projectId: string }, entityId: string): Promise<HistoryEvent> {
  const { events } = await history(ids, { entityId });
  expect(events.length).toBeGreaterThan(0);
  return events[0];
}

const engineerBy = () => ({ id: t.people.engineer.id, name: expect.anything(), email: t.people.engineer.email });
const issuePaths = (body: unknown) => apiErrorSchema.parse(body).error.issues.map((i) => i.path);

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
});

afterAll(async () => {
  await t?.close();
});

describe('every change is recorded with who, when, what, before and after', () => {
  it('structures, modes, load cases and comfort criteria: create, update, delete', async () => {
    const startedAt = Date.now();
    const ids = await newProject('History model footbridge');
    const created = await history(ids);
    // Newest first: criteria, walker, crowd, mode, structure.
    expect(created.events.map((e) => [e.entity, e.action, e.label])).toEqual([
      ['comfort-criteria', 'create', 'Test criteria'],
      ['load-case', 'create', 'Test walker'],
      ['load-case', 'create', 'Test crowd'],
      ['mode', 'create', 'Test vertical mode'],
      ['structure', 'create', 'Test span'],
    ]);
    for (const event of created.events) {
      expect(event.by).toEqual(engineerBy());
      expect(Date.parse(event.at)).toBeGreaterThanOrEqual(startedAt - 1000);
    }
    const modeCreated = created.events[3];
    expect(modeCreated.entityId).toBe(ids.modeId);
    expect(modeCreated.changes).toMatchObject({ frequencyHz: { after: 2.0 }, modalMassKg: { after: 30_000 }, label: { after: 'Test vertical mode' } });
    expect(modeCreated.changes.frequencyHz.before).toBeUndefined();
    // Bookkeeping is left out.
    for (const field of ['id', 'version', 'createdBy', 'createdAt', 'updatedAt']) expect(modeCreated.changes[field]).toBeUndefined();

    // Update: only what differs, with both values, in the API's field names.
    const crowdUrl = `/api/projects/${ids.projectId}/load-cases/${ids.crowdId}`;
    await agents.admin.patch(crowdUrl).send({ version: 1, spec: { ...crowdSpec, densityPerM2: 0.8 } }).expect(200);
    const crowdChanged = await latest(ids, ids.crowdId);
    expect(crowdChanged).toMatchObject({ entity: 'load-case', action: 'update', label: 'Test crowd', by: { id: t.people.admin.id, email: t.people.admin.email } });
    expect(Object.keys(crowdChanged.changes)).toEqual(['spec']);
    expect((crowdChanged.changes.spec.before as { densityPerM2: number }).densityPerM2).toBe(0.5);
    expect((crowdChanged.changes.spec.after as { densityPerM2: number }).densityPerM2).toBe(0.8);

    const structureUrl = `/api/projects/${ids.projectId}/structures/${ids.structureId}`;
    await agents.engineer.patch(structureUrl).send({ version: 1, spanM: 42, deckAreaM2: 120 }).expect(200);
    expect((await latest(ids, ids.structureId)).changes).toEqual({ spanM: { before: null, after: 42 }, deckAreaM2: { before: null, after: 120 } });

    const modeUrl = `/api/projects/${ids.projectId}/structures/${ids.structureId}/modes/${ids.modeId}`;
    await agents.engineer.patch(modeUrl).send({ version: 1, dampingRatio: 0.007 }).expect(200);
    expect((await latest(ids, ids.modeId)).changes).toEqual({ dampingRatio: { before: 0.005, after: 0.007 } });

    const criteriaUrl = `/api/projects/${ids.projectId}/comfort-criteria/${ids.criteriaId}`;
    await agents.engineer.patch(criteriaUrl).send({ version: 1, name: 'Test criteria, mean comfort', spec: { set: 'setra', class: 'mean' } }).expect(200);
    const criteriaChanged = await latest(ids, ids.criteriaId);
    expect(criteriaChanged.changes.name).toEqual({ before: 'Test criteria', after: 'Test criteria, mean comfort' });
    expect(criteriaChanged.label).toBe('Test criteria, mean comfort');

    // Delete: before only.
    await agents.engineer.delete(`/api/projects/${ids.projectId}/load-cases/${ids.walkerId}`).expect(204);
    const walkerDeleted = await latest(ids, ids.walkerId);
    expect(walkerDeleted).toMatchObject({ action: 'delete', label: 'Test walker', by: engineerBy() });
    expect(walkerDeleted.changes.name).toEqual({ before: 'Test walker' });
    expect(walkerDeleted.changes.spec.before).toMatchObject(walkerSpec);
    await agents.engineer.delete(criteriaUrl).expect(204);
    expect((await latest(ids, ids.criteriaId)).action).toBe('delete');
    await agents.engineer.delete(modeUrl).expect(204);
    expect((await latest(ids, ids.modeId)).changes.frequencyHz).toEqual({ before: 2.0 });
    await agents.engineer.delete(structureUrl).expect(204);
    expect((await latest(ids, ids.structureId))).toMatchObject({ action: 'delete', label: 'Test span' });
  });

  it('lumped models and the modes re-derived from them', async () => {
    const ids = await newProject('History lumped footbridge');
    const base = `/api/projects/${ids.projectId}/structures/${ids.structureId}`;
    const model = (await agents.engineer.post(`${base}/models`).send({ name: 'Two masses', massMatrixKg: massKg, stiffnessMatrixNPerM: stiffnessNPerM }).expect(201)).body as { id: string };
    const created = await latest(ids, model.id);
    expect(created).toMatchObject({ entity: 'lumped-model', action: 'create', label: 'Two masses', by: engineerBy() });
    expect(created.changes.stiffnessMatrixNPerM).toEqual({ after: stiffnessNPerM });
    const derived = (await agents.engineer.post(`${base}/modes`).send({ label: 'From the model', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 1 } }).expect(201))
      .body as { id: string; frequencyHz: number };

    const stiffer = stiffnessNPerM.map((row) => row.map((k) => k * 1.21));
    await agents.admin.patch(`${base}/models/${model.id}`).send({ version: 1, stiffnessMatrixNPerM: stiffer }).expect(200);
    const modelChanged = await latest(ids, model.id);
    expect(modelChanged.changes).toEqual({ stiffnessMatrixNPerM: { before: stiffnessNPerM, after: stiffer } });
    expect(modelChanged.by?.id).toBe(t.people.admin.id);
    const modeRederived = await latest(ids, derived.id);
    expect(modeRederived).toMatchObject({ entity: 'mode', action: 'update', by: { id: t.people.admin.id } });
    // Stiffness × 1.21 raises every frequency by √1.21 = 1.1 (f ∝ √(k/m)).
    expect(modeRederived.changes.frequencyHz.before).toBe(derived.frequencyHz);
    expect(modeRederived.changes.frequencyHz.after as number).toBeCloseTo(derived.frequencyHz * 1.1, 9);

    await agents.engineer.delete(`${base}/modes/${derived.id}`).expect(204);
    await agents.engineer.delete(`${base}/models/${model.id}`).expect(204);
    expect(await latest(ids, model.id)).toMatchObject({ action: 'delete', label: 'Two masses' });
  });

  it('tuning variants with their load-case list, size apply, delete; a read that recomputes records nothing', async () => {
    const ids = await newProject('History variants footbridge');
    const variant = await createVariant(ids);
    const created = await latest(ids, variant.id);
    expect(created).toMatchObject({ entity: 'tuning-variant', action: 'create', label: variant.name, by: engineerBy() });
    expect(created.changes.loadCaseIds).toEqual({ after: [ids.crowdId] });
    expect(created.changes.massRatio).toEqual({ after: 0.02 });
    // The stored result is a cache of the recorded inputs: never copied.
    for (const field of ['result', 'resultError', 'inputsHash', 'engineVersion', 'computedAt']) expect(created.changes[field]).toBeUndefined();
    const variantsUrl = `/api/projects/${ids.projectId}/variants`;

    // Only the list changes: one entry for the variant, the list before and after, the load cases named.
    await agents.engineer.patch(`${variantsUrl}/${variant.id}`).send({ version: 1, loadCaseIds: [ids.walkerId, ids.crowdId] }).expect(200);
    const listChanged = await history(ids, { entityId: variant.id });
    expect(listChanged.events).toHaveLength(2);
    expect(listChanged.events[0].action).toBe('update');
    expect(listChanged.events[0].changes).toEqual({ loadCaseIds: { before: [ids.crowdId], after: [ids.walkerId, ids.crowdId] } });
    expect(listChanged.names[ids.walkerId]).toBe('Test walker');
    expect(listChanged.names[ids.crowdId]).toBe('Test crowd');

    // Fields and list together make one entry; the same list given again adds nothing to it.
    await agents.engineer.patch(`${variantsUrl}/${variant.id}`).send({ version: 2, name: 'Test renamed', loadCaseIds: [ids.walkerId, ids.crowdId] }).expect(200);
    const renamed = await history(ids, { entityId: variant.id });
    expect(renamed.events).toHaveLength(3);
    expect(renamed.events[0].changes).toEqual({ name: { before: 'Test Den Hartog 2 %', after: 'Test renamed' } });

    // Size and apply: the mass ratio's change.
    const sized = (await agents.engineer.post(`${variantsUrl}/${variant.id}/size`).send({ apply: true, version: 3 }).expect(200)).body as { massRatio: number };
    const applied = await latest(ids, variant.id);
    expect(applied.changes).toEqual({ massRatio: { before: 0.02, after: sized.massRatio } });
    expect(applied.by).toEqual(engineerBy());

    // A change of the mode makes the variant's stored result stale: reading it recomputes and stores it, and records
    // only the mode's change, nothing for the read.
    await agents.engineer.patch(`/api/projects/${ids.projectId}/structures/${ids.structureId}/modes/${ids.modeId}`).send({ version: 1, frequencyHz: 2.1 }).expect(200);
    const before = (await history(ids)).events.length;
    const [{ hash: hashBefore }] = (await t.ctx.db.execute<{ hash: string }>(sql`select inputs_hash as hash from tuning_variants where id = ${variant.id}`)).rows;
    await agents.viewer.get(`${variantsUrl}/${variant.id}`).expect(200);
    await agents.viewer.get(variantsUrl).expect(200);
    const [{ hash: hashAfter }] = (await t.ctx.db.execute<{ hash: string }>(sql`select inputs_hash as hash from tuning_variants where id = ${variant.id}`)).rows;
    expect(hashAfter).not.toBe(hashBefore);
    expect((await history(ids)).events.length).toBe(before);

    // A copy is a new variant (the client posts it as one).
    const copy = await createVariant(ids, { name: 'Test copy', loadCaseIds: [ids.walkerId] });
    expect((await latest(ids, copy.id)).action).toBe('create');

    await agents.engineer.delete(`${variantsUrl}/${variant.id}`).expect(204);
    const deleted = await latest(ids, variant.id);
    expect(deleted).toMatchObject({ action: 'delete', label: 'Test renamed' });
    expect(deleted.changes.massRatio).toEqual({ before: sized.massRatio });
  });

  it('sign-offs submitted, returned and approved, with the comfort criteria status moving', async () => {
    const ids = await newProject('History sign-off footbridge');
    const variant = await createVariant(ids);
    const signOffsUrl = `/api/projects/${ids.projectId}/sign-offs`;

    const first = (await agents.engineer.post(signOffsUrl).send({ variantId: variant.id, message: 'Please check.' }).expect(201)).body as { id: string };
    const submitted = await history(ids, { entity: 'sign-off' });
    expect(submitted.events).toHaveLength(1);
    expect(submitted.events[0]).toMatchObject({ entityId: first.id, action: 'submitted', label: variant.name, by: engineerBy() });
    expect(submitted.events[0].changes.snapshot).toEqual({ changed: true });
    expect(submitted.events[0].changes.message).toEqual({ after: 'Please check.' });
    expect(submitted.events[0].changes.variantId).toEqual({ after: variant.id });
    expect(submitted.names[variant.id]).toBe(variant.name);
    const criteriaSubmitted = await latest(ids, ids.criteriaId);
    expect(criteriaSubmitted).toMatchObject({ entity: 'comfort-criteria', action: 'update', by: engineerBy() });
    expect(criteriaSubmitted.changes).toEqual({ status: { before: 'draft', after: 'submitted' } });

    await agents.owner.post(`${signOffsUrl}/${first.id}/return`).send({ comment: 'Add the walker.' }).expect(200);
    const returned = await latest(ids, first.id);
    expect(returned).toMatchObject({ action: 'returned', by: { id: t.people.owner.id, email: t.people.owner.email } });
    expect(returned.changes).toEqual({ status: { before: 'submitted', after: 'returned' }, decisionComment: { before: null, after: 'Add the walker.' } });
    expect((await latest(ids, ids.criteriaId)).changes).toEqual({ status: { before: 'submitted', after: 'returned' } });

    await agents.engineer.patch(`/api/projects/${ids.projectId}/variants/${variant.id}`).send({ version: 1, loadCaseIds: [ids.crowdId, ids.walkerId] }).expect(200);
    const second = (await agents.engineer.post(signOffsUrl).send({ variantId: variant.id }).expect(201)).body as { id: string };
    await agents.owner.post(`${signOffsUrl}/${second.id}/approve`).send({}).expect(200);
    const approved = await latest(ids, second.id);
    expect(approved).toMatchObject({ entity: 'sign-off', action: 'approved', by: { id: t.people.owner.id } });
    expect(approved.changes.status).toEqual({ before: 'submitted', after: 'approved' });
    const criteriaApproved = await latest(ids, ids.criteriaId);
    expect(criteriaApproved.changes).toEqual({ status: { before: 'submitted', after: 'approved' } });
    expect(criteriaApproved.by?.id).toBe(t.people.owner.id);

    // The filter by action finds each decision.
    expect((await history(ids, { action: 'approved' })).events.map((e) => e.entityId)).toEqual([second.id]);
    expect((await history(ids, { action: 'returned' })).events.map((e) => e.entityId)).toEqual([first.id]);
    expect((await history(ids, { action: 'submitted' })).events.map((e) => e.entityId)).toEqual([second.id, first.id]);

    // A change the freeze refuses records nothing, and neither does a stale version.
    const count = (await history(ids, { pageSize: 200 })).events.length;
    const frozen = await agents.engineer.patch(`/api/projects/${ids.projectId}/load-cases/${ids.crowdId}`).send({ version: 1, name: 'Frozen?' });
    expect(frozen.status).toBe(409);
    // Even past the services' own check, the database's freeze rolls the entry back with the change.
    await expect(t.ctx.db.execute(sql`update load_cases set name = 'Frozen?' where id = ${ids.crowdId}`)).rejects.toThrow();
    const stale = await agents.engineer.patch(`/api/projects/${ids.projectId}/load-cases/${ids.walkerId}`).send({ version: 99, name: 'Stale' });
    expect(stale.status).toBe(409);
    expect((await history(ids, { pageSize: 200 })).events.length).toBe(count);
  });

  it('site records: upload, analyse again, a re-tuned variant, delete; an SQL change without a person is recorded with none', async () => {
    const ids = await newProject('History site footbridge');
    const csv = demoSiteRecordCsv(demoSiteRecords[0]);
    const uploaded = await agents.fabricator
      .post(`/api/projects/${ids.projectId}/site-records`)
      .field('structureId', ids.structureId)
      .field('modeId', ids.modeId)
      .field('condition', 'without-damper')
      .attach('file', Buffer.from(csv), { filename: 'heel-drop.csv', contentType: 'text/csv' });
    expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201);
    const recordId = uploaded.body.id as string;
    const created = await latest(ids, recordId);
    expect(created).toMatchObject({ entity: 'site-record', action: 'create', label: 'heel-drop.csv', by: { id: t.people.fabricator.id } });
    // The raw samples and the analysis are not copied.
    expect(created.changes.fileBytes).toEqual({ changed: true });
    expect(created.changes.analysis).toEqual({ changed: true });
    expect(created.changes.condition).toEqual({ after: 'without-damper' });

    await agents.engineer.post(`/api/projects/${ids.projectId}/site-records/${recordId}/analyse`).send({ method: 'spectrum', bandHz: [1, 3], version: 1 }).expect(200);
    const analysed = await latest(ids, recordId);
    expect(analysed).toMatchObject({ action: 'update', by: engineerBy() });
    expect(analysed.changes).toEqual({ analysis: { changed: true } });

    // A re-tuned variant made from the record is a new variant, recorded as the engineer's.
    const design = await createVariant(ids);
    const retuned = await agents.engineer.post(`/api/projects/${ids.projectId}/site-records/${recordId}/retuned-variant`).send({ variantId: design.id });
    expect(retuned.status, JSON.stringify(retuned.body)).toBe(201);
    const retunedCreated = await latest(ids, retuned.body.id as string);
    expect(retunedCreated).toMatchObject({ entity: 'tuning-variant', action: 'create', label: retuned.body.name, by: engineerBy() });
    expect(retunedCreated.changes.tuning.after).toEqual(retuned.body.tuning);

    // A write outside the services (no person set) is still recorded, with no person.
    await t.ctx.db.execute(sql`update site_records set notes = 'Typed in by a script' where id = ${recordId}`);
    const scripted = await latest(ids, recordId);
    expect(scripted.by).toBeNull();
    expect(scripted.changes).toEqual({ notes: { before: null, after: 'Typed in by a script' } });

    // The stored file is compared, never copied: a change of its bytes alone says so, and no entry holds the file.
    await t.ctx.db.execute(sql`update site_records set file_bytes = file_bytes || '\n'::bytea where id = ${recordId}`);
    const refiled = await latest(ids, recordId);
    expect(refiled.by).toBeNull();
    expect(refiled.changes).toEqual({ fileBytes: { changed: true } });
    const [{ largest }] = (
      await t.ctx.db.execute<{ largest: number }>(sql`select max(octet_length(changes::text)) as largest from history_events where entity_id = ${recordId}`)
    ).rows;
    expect(csv.length).toBeGreaterThan(100_000);
    expect(Number(largest)).toBeLessThan(2_000);

    await agents.engineer.delete(`/api/projects/${ids.projectId}/site-records/${recordId}`).expect(204);
    expect(await latest(ids, recordId)).toMatchObject({ action: 'delete', label: 'heel-drop.csv' });
  });
});

describe('reading the history', () => {
  it('pages newest first and filters by kind, action, person and time', async () => {
    const ids = await newProject('History paging footbridge');
    await agents.admin.patch(`/api/projects/${ids.projectId}/load-cases/${ids.walkerId}`).send({ version: 1, name: 'Test walker, renamed' }).expect(200);
    const all = await history(ids);
    expect(all.events).toHaveLength(6);
    expect(all.paging).toEqual({ page: 1, pageSize: 50, hasMore: false });

    const page1 = await history(ids, { pageSize: 4 });
    const page2 = await history(ids, { pageSize: 4, page: 2 });
    expect(page1.paging).toEqual({ page: 1, pageSize: 4, hasMore: true });
    expect(page2.paging).toEqual({ page: 2, pageSize: 4, hasMore: false });
    expect([...page1.events, ...page2.events].map((e) => e.id)).toEqual(all.events.map((e) => e.id));
    const times = all.events.map((e) => Date.parse(e.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);

    expect((await history(ids, { entity: 'load-case' })).events.map((e) => e.action)).toEqual(['update', 'create', 'create']);
    expect((await history(ids, { action: 'update' })).events.map((e) => e.entityId)).toEqual([ids.walkerId]);
    expect((await history(ids, { by: t.people.admin.id })).events).toHaveLength(1);
    expect((await history(ids, { by: t.people.engineer.id })).events).toHaveLength(5);
    const last = all.events[0].at;
    expect((await history(ids, { from: last })).events.map((e) => e.id)).toEqual([all.events[0].id]);
    expect((await history(ids, { to: last })).events).toHaveLength(5);
    expect((await history(ids, { from: '2000-01-01T00:00:00Z', to: '2000-01-02T00:00:00Z' })).events).toHaveLength(0);
  });

  it('every role of the organisation reads it; another organisation gets 404; a bad filter is 400 naming it', async () => {
    const ids = await newProject('History access footbridge');
    for (const role of roles) expect((await history(ids, {}, agents[role])).events.length).toBe(5);
    const outside = await outsiderAgent.get(`/api/projects/${ids.projectId}/history`);
    expect(outside.status).toBe(404);
    await agents.engineer.get(`/api/projects/${t.outsiderProjectId}/history`).expect(404);

    const bad: [Record<string, string>, string][] = [
      [{ action: 'edited' }, 'action'],
      [{ entity: 'Load Case' }, 'entity'],
      [{ by: 'someone' }, 'by'],
      [{ from: 'yesterday' }, 'from'],
      [{ to: '2026-01-01' }, 'to'],
      [{ from: '2026-02-01T00:00:00Z', to: '2026-01-01T00:00:00Z' }, 'to'],
      [{ pageSize: '500' }, 'pageSize'],
    ];
    for (const [query, field] of bad) {
      const response = await agents.viewer.get(`/api/projects/${ids.projectId}/history`).query(query);
      expect(response.status, JSON.stringify(query)).toBe(400);
      expect(issuePaths(response.body)).toEqual([field]);
    }
  });
});
