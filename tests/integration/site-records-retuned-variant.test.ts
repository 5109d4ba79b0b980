/**
 * A re-tuned variant from a site record against a real PostgreSQL: a copy of a variant on the record's mode whose
 * damper is set by hand to what the variant's method gives for the structure as measured, created through the
 * variants' own create path; roles, the mode, the project, a hand-tuned variant and records that cannot be re-tuned
 * from. The records are free decays made in the test (a single-DOF oscillator), not site data; every value here is an
 * invented test input.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { siteRecordSchema, type SiteRecord } from '../../shared/contracts/site-records';
import { variantSchema, type Variant } from '../../shared/contracts/variants';
import { decayRecord } from '../../shared/engine/signal/test-records';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;
let admin: Agent;
const readers: Record<string, Agent> = {};
let projectId: string;
let modeId: string;
let otherModeId: string;
let loadCaseId: string;
let criteriaId: string;
let bare: SiteRecord;
let coupled: SiteRecord;
let noMode: SiteRecord;
let denHartog: Variant;
let manual: Variant;
let onOtherMode: Variant;
let otherProjectVariant: Variant;

const rateHz = 50;
/** The "measured" structure: 5 % below the design mode's 2 Hz, more damping than assumed. */
const measuredDeck = { frequencyHz: 1.9, dampingRatio: 0.012, sampleRateHz: rateHz };
const coupledDeck = { frequencyHz: 1.85, dampingRatio: 0.035, sampleRateHz: rateHz };

function decayCsv(oscillator: typeof measuredDeck, seed = 11): string {
  const column = decayRecord(oscillator, 60, seed, { noiseStd: 1e-4, quietS: 2 });
  const lines = ['time_s,acc_mps2'];
  for (let n = 0; n < column.length; n++) lines.push(`${(n / rateHz).toFixed(4)},${column[n].toPrecision(7)}`);
  return `${lines.join('\n')}\n`;
}

async function upload(fields: Record<string, string>, oscillator: typeof measuredDeck, fileName: string): Promise<SiteRecord> {
  const req = engineer.post(`/api/projects/${projectId}/site-records`);
  for (const [key, value] of Object.entries(fields)) req.field(key, value);
  const response = await req.attach('file', Buffer.from(decayCsv(oscillator)), { filename: fileName, contentType: 'text/csv' });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return siteRecordSchema.parse(response.body);
}

async function createVariant(project: string, body: Record<string, unknown>): Promise<Variant> {
  const response = await engineer.post(`/api/projects/${project}/variants`).send(body);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return variantSchema.parse(response.body);
}

const retunedUrl = (record: SiteRecord) => `/api/projects/${projectId}/site-records/${record.id}/retuned-variant`;
const issuePaths = (body: unknown) => apiErrorSchema.parse(body).error.issues.map((issue) => issue.path);

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signIn(t.app, t.people.engineer.email);
  admin = await signIn(t.app, t.people.admin.email);
  for (const role of ['viewer', 'fabricator', 'owner'] as const) readers[role] = await signIn(t.app, t.people[role].email);
  projectId = (await engineer.post('/api/projects').send({ name: 'Re-tune test bridge', kind: 'footbridge' }).expect(201)).body.id;
  const structureId = (await engineer.post(`/api/projects/${projectId}/structures`).send({ name: 'Test span', kind: 'footbridge-span' }).expect(201)).body.id;
  modeId = (
    await engineer
      .post(`/api/projects/${projectId}/structures/${structureId}/modes`)
      .send({ label: 'Test vertical', direction: 'vertical', frequencyHz: 2, modalMassKg: 30_000, dampingRatio: 0.005, modeShapeMean: 0.6 })
      .expect(201)
  ).body.id;
  otherModeId = (
    await engineer
      .post(`/api/projects/${projectId}/structures/${structureId}/modes`)
      .send({ label: 'Test second vertical', direction: 'vertical', frequencyHz: 3.4, modalMassKg: 25_000, dampingRatio: 0.005, modeShapeMean: 0.6 })
      .expect(201)
  ).body.id;
  loadCaseId = (
    await engineer
      .post(`/api/projects/${projectId}/load-cases`)
      .send({ name: 'Test crowd', spec: { kind: 'crowd', guide: 'setra', densityPerM2: 0.8, deckAreaM2: 120, harmonic: 1 } })
      .expect(201)
  ).body.id;
  criteriaId = (await engineer.post(`/api/projects/${projectId}/comfort-criteria`).send({ name: 'Test criteria', spec: { set: 'setra', class: 'maximum' } }).expect(201)).body.id;
  const common = { loadCaseIds: [loadCaseId], criteriaId, massRatio: 0.02 };
  denHartog = await createVariant(projectId, {
    ...common,
    name: 'Test Den Hartog 2 %',
    modeId,
    tuning: { method: 'den-hartog' },
    unitCount: 2,
    structureFrequencyToleranceRatio: 0.08,
    tmdDampingToleranceRatio: 0.15,
    hardware: { strokeLimitM: 0.05 },
  });
  manual = await createVariant(projectId, { ...common, name: 'Test by hand', modeId, tuning: { frequencyHz: 1.95, dampingRatio: 0.08 } });
  onOtherMode = await createVariant(projectId, { ...common, name: 'Test second mode', modeId: otherModeId, tuning: { method: 'den-hartog' } });

  const otherProject = (await engineer.post('/api/projects').send({ name: 'Re-tune sibling', kind: 'footbridge' }).expect(201)).body.id as string;
  const otherStructure = (await engineer.post(`/api/projects/${otherProject}/structures`).send({ name: 'Sibling span', kind: 'footbridge-span' }).expect(201)).body.id;
  const siblingMode = (
    await engineer
      .post(`/api/projects/${otherProject}/structures/${otherStructure}/modes`)
      .send({ label: 'Sibling vertical', direction: 'vertical', frequencyHz: 2, modalMassKg: 30_000, dampingRatio: 0.005 })
      .expect(201)
  ).body.id;
  const siblingLoadCase = (await engineer.post(`/api/projects/${otherProject}/load-cases`).send({ name: 'Sibling walker', spec: { kind: 'walker' } }).expect(201)).body.id;
  const siblingCriteria = (await engineer.post(`/api/projects/${otherProject}/comfort-criteria`).send({ name: 'Sibling criteria', spec: { set: 'setra', class: 'maximum' } }).expect(201)).body.id;
  otherProjectVariant = await createVariant(otherProject, {
    name: 'Sibling Den Hartog',
    modeId: siblingMode,
    loadCaseIds: [siblingLoadCase],
    criteriaId: siblingCriteria,
    massRatio: 0.02,
    tuning: { method: 'den-hartog' },
  });

  bare = await upload({ structureId, modeId, condition: 'without-damper', measuredAt: '2026-05-04T10:30:00Z' }, measuredDeck, 'bare-deck.csv');
  coupled = await upload({ structureId, modeId, condition: 'with-damper' }, coupledDeck, 'with-damper.csv');
  noMode = await upload({ structureId, condition: 'damper-locked' }, measuredDeck, 'no-mode.csv');
});

afterAll(async () => {
  await t?.close();
});

describe('a re-tuned variant from a site record', () => {
  it('copies a Den Hartog variant with the damper Den Hartog gives for the measured structure, set by hand', async () => {
    const response = await engineer.post(retunedUrl(bare)).send({ variantId: denHartog.id });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const made = variantSchema.parse(response.body);
    expect(response.headers.location).toBe(`/api/projects/${projectId}/variants/${made.id}`);
    expect(made.id).not.toBe(denHartog.id);

    const fMeasured = bare.analysis.frequencyHz!;
    const mu = 0.02;
    // Den Hartog, Mechanical Vibrations (4th ed., 1956; edition from memory): optimum damper frequency f_s / (1 + μ) and damping ratio
    // √(3μ / (8 (1 + μ))), referred to the damper's own frequency.
    expect(made.tuning).toEqual({ frequencyHz: expect.any(Number), dampingRatio: expect.any(Number) });
    const tuning = made.tuning as { frequencyHz: number; dampingRatio: number };
    expect(tuning.frequencyHz).toBeCloseTo(fMeasured / (1 + mu), 10);
    expect(tuning.dampingRatio).toBeCloseTo(Math.sqrt((3 * mu) / (8 * (1 + mu))), 12);
    // The measured frequency is the test oscillator's (identify's own decay tolerance, docs/engine.md: 0.05 %).
    expect(Math.abs(fMeasured / measuredDeck.frequencyHz - 1)).toBeLessThan(5e-4);

    // Everything else is the original's.
    expect(made).toMatchObject({
      modeId,
      loadCaseIds: [loadCaseId],
      criteriaId,
      massRatio: mu,
      unitCount: 2,
      structureFrequencyToleranceRatio: 0.08,
      tmdDampingToleranceRatio: 0.15,
      hardware: denHartog.hardware,
      name: 'Test Den Hartog 2 % re-tuned to bare-deck.csv',
    });
    expect(made.notes).toContain('Re-tuned from site record bare-deck.csv (measured 2026-05-04T10:30:00.000Z)');
    expect(made.notes).toContain('"Test Den Hartog 2 %"');
    expect(made.notes).toContain('design mode Test vertical');

    // Computed like any variant: the damper is the one set, the result on the design mode as stored (2 Hz ± 8 %).
    expect(made.result).not.toBeNull();
    expect(made.result!.tmd.frequencyHz).toBeCloseTo(tuning.frequencyHz, 12);
    expect(made.result!.tmd.dampingRatio).toBeCloseTo(tuning.dampingRatio, 12);
    expect(made.result!.tmd.massKg).toBeCloseTo(mu * 30_000, 9);
    expect(made.result!.detuning.structureFrequencyRangeHz[0]).toBeCloseTo(2 * 0.92, 12);
    expect(made.result!.detuning.structureFrequencyRangeHz[1]).toBeCloseTo(2 * 1.08, 12);
    // The same variant typed in by hand gives the same numbers: the create path is the variants' own.
    const byHand = await createVariant(projectId, {
      name: 'Test same by hand',
      modeId,
      loadCaseIds: [loadCaseId],
      criteriaId,
      massRatio: mu,
      tuning,
      unitCount: 2,
      structureFrequencyToleranceRatio: 0.08,
      tmdDampingToleranceRatio: 0.15,
      hardware: denHartog.hardware,
    });
    expect(byHand.result!.governing).toEqual(made.result!.governing);
    expect(byHand.result!.detuning).toEqual(made.result!.detuning);

    const named = variantSchema.parse((await admin.post(retunedUrl(bare)).send({ variantId: denHartog.id, name: '  As built, May  ' }).expect(201)).body);
    expect(named.name).toBe('As built, May');
  });

  it.each(['viewer', 'fabricator', 'owner'])('refuses the %s (403)', async (role) => {
    const response = await readers[role].post(retunedUrl(bare)).send({ variantId: denHartog.id }).expect(403);
    expect(apiErrorSchema.parse(response.body).error.code).toBeTruthy();
  });

  it('names variantId for a variant of another mode, of another project, tuned by hand, or not a UUID (400)', async () => {
    for (const variantId of [onOtherMode.id, otherProjectVariant.id, manual.id, 'not-a-uuid']) {
      const response = await engineer.post(retunedUrl(bare)).send({ variantId }).expect(400);
      expect(issuePaths(response.body)).toEqual(['variantId']);
    }
    const manualRefusal = await engineer.post(retunedUrl(bare)).send({ variantId: manual.id }).expect(400);
    expect(apiErrorSchema.parse(manualRefusal.body).error.message).toMatch(/tuned by hand/);
    const unknownField = await engineer.post(retunedUrl(bare)).send({ variantId: denHartog.id, mode: modeId }).expect(400);
    expect(issuePaths(unknownField.body)).toContain('mode');
  });

  it('refuses a with-damper record and a record without a mode (409), and stores no variant', async () => {
    const before = (await engineer.get(`/api/projects/${projectId}/variants`).expect(200)).body.variants.length;
    const withDamper = await engineer.post(retunedUrl(coupled)).send({ variantId: denHartog.id }).expect(409);
    expect(apiErrorSchema.parse(withDamper.body).error.code).toBe('not_the_bare_structure');
    const withoutMode = await engineer.post(retunedUrl(noMode)).send({ variantId: denHartog.id }).expect(409);
    expect(apiErrorSchema.parse(withoutMode.body).error.code).toBe('no_design_mode');
    const after = (await engineer.get(`/api/projects/${projectId}/variants`).expect(200)).body.variants.length;
    expect(after).toBe(before);
  });
});
