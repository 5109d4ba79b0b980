/**
 * Site records against a real PostgreSQL: upload of a CSV made in the test from a known free decay (a single-DOF
 * oscillator, closed form: Chopra, Dynamics of Structures, ch. 2, from memory), the file rules, roles and
 * organisations, a new analysis, the comparison with the design mode and the re-tune. Test inputs, not site data.
 */
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { siteRecords } from '../../server/db/schema';
import { demoSiteRecordCsv, demoSiteRecords } from '../../server/db/seed';
import { analyseRecord } from '../../server/modules/site-records/site-record-analysis';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { retuneResponseSchema, siteRecordListSchema, siteRecordSchema, siteRecordTimeHistorySchema, type SiteRecord } from '../../shared/contracts/site-records';
import { decayRecord } from '../../shared/engine/signal/test-records';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;
let fabricator: Agent;
let viewer: Agent;
let owner: Agent;
let outsider: Agent;
let projectId: string;
let structureId: string;
let modeId: string;
let otherStructureModeId: string;

const rateHz = 50;
const deck = { frequencyHz: 1.9, dampingRatio: 0.012, sampleRateHz: rateHz };
const pier = { frequencyHz: 3.1, dampingRatio: 0.02, sampleRateHz: rateHz };
const damped = { frequencyHz: 1.85, dampingRatio: 0.035, sampleRateHz: rateHz };

/** A CSV of a free decay: time in s, then one column per oscillator (a heel drop after 2 s of quiet, light noise). */
function decayCsv(oscillators: (typeof deck)[], { separator = ',', durationS = 60, seed = 7 } = {}): string {
  const columns = oscillators.map((o, i) => decayRecord(o, durationS, seed + i, { noiseStd: 1e-4, quietS: 2 }));
  const names = ['time_s', ...oscillators.map((_, i) => `acc_${i + 1}_mps2`)];
  const lines = [names.join(separator)];
  for (let n = 0; n < columns[0].length; n++) lines.push([(n / rateHz).toFixed(4), ...columns.map((c) => c[n].toPrecision(7))].join(separator));
  return `${lines.join('\n')}\n`;
}

const storedCount = async () => (await t.ctx.db.select({ n: count() }).from(siteRecords).where(eq(siteRecords.projectId, projectId)))[0].n;

function upload(agent: Agent, file: string | Buffer, fields: Record<string, string>, fileName = 'record.csv') {
  const req = agent.post(`/api/projects/${projectId}/site-records`);
  for (const [key, value] of Object.entries(fields)) req.field(key, value);
  return req.attach('file', Buffer.isBuffer(file) ? file : Buffer.from(file), { filename: fileName, contentType: 'text/csv' });
}

function expectFileError(body: unknown, pattern: RegExp) {
  const error = apiErrorSchema.parse(body).error;
  expect(error.issues.map((i) => i.path)).toEqual(['file']);
  expect(error.issues[0].message).toMatch(pattern);
}

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signIn(t.app, t.people.engineer.email);
  fabricator = await signIn(t.app, t.people.fabricator.email);
  viewer = await signIn(t.app, t.people.viewer.email);
  owner = await signIn(t.app, t.people.owner.email);
  outsider = await signIn(t.app, t.outsider.email);
  projectId = (await engineer.post('/api/projects').send({ name: 'Site record test bridge', kind: 'footbridge' }).expect(201)).body.id;
  structureId = (await engineer.post(`/api/projects/${projectId}/structures`).send({ name: 'Test span', kind: 'footbridge-span' }).expect(201)).body.id;
  modeId = (
    await engineer
      .post(`/api/projects/${projectId}/structures/${structureId}/modes`)
      .send({ label: 'Test vertical', direction: 'vertical', frequencyHz: 2, modalMassKg: 30_000, dampingRatio: 0.005 })
      .expect(201)
  ).body.id;
  const other = (await engineer.post(`/api/projects/${projectId}/structures`).send({ name: 'Other span', kind: 'footbridge-span' }).expect(201)).body.id;
  otherStructureModeId = (
    await engineer
      .post(`/api/projects/${projectId}/structures/${other}/modes`)
      .send({ label: 'Other vertical', direction: 'vertical', frequencyHz: 3, modalMassKg: 20_000, dampingRatio: 0.005 })
      .expect(201)
  ).body.id;
});

afterAll(async () => {
  await t?.close();
});

let first: SiteRecord;

describe('upload and analysis', () => {
  it('finds the frequency and damping of a decay made in the test (engineer uploads)', async () => {
    const csv = decayCsv([deck, pier]);
    const response = await upload(engineer, csv, { structureId, modeId, condition: 'without-damper', notes: 'test decay' }).expect(201);
    first = siteRecordSchema.parse(response.body);
    // The file is kept byte for byte, so that it can be analysed again.
    const [stored] = await t.ctx.db.select({ fileBytes: siteRecords.fileBytes }).from(siteRecords).where(eq(siteRecords.id, first.id));
    expect(Buffer.compare(stored.fileBytes, Buffer.from(csv))).toBe(0);
    expect(first.fileSizeBytes).toBe(Buffer.byteLength(csv));
    expect(first.channel).toBe('acc_1_mps2');
    expect(first.channels).toEqual(['acc_1_mps2', 'acc_2_mps2']);
    expect(first.sampleRateHz).toBeCloseTo(rateHz, 6);
    expect(first.analysis.method).toBe('decay');
    // Tolerances as the identify command's own decay checks (docs/engine.md: f 0.05 %, ζ 3 %).
    expect(Math.abs(first.analysis.frequencyHz! / deck.frequencyHz - 1)).toBeLessThan(5e-4);
    expect(Math.abs(first.analysis.dampingRatio! / deck.dampingRatio - 1)).toBeLessThan(0.03);
    expect(response.headers.location).toBe(`/api/projects/${projectId}/site-records/${first.id}`);
    // 3000 samples: the plot gets them all, at the file's times.
    const history = siteRecordTimeHistorySchema.parse((await viewer.get(`/api/projects/${projectId}/site-records/${first.id}/time-history`).expect(200)).body);
    expect(history).toMatchObject({ channel: 'acc_1_mps2', sampleCount: 3000, thinned: false });
    expect(history.timesS[1500]).toBeCloseTo(30, 9);
    await outsider.get(`/api/projects/${projectId}/site-records/${first.id}/time-history`).expect(404);
  });

  it('analyses the channel chosen by name or index', async () => {
    for (const channel of ['acc_2_mps2', '1']) {
      const record = siteRecordSchema.parse((await upload(engineer, decayCsv([deck, pier]), { structureId, condition: 'damper-locked', channel }).expect(201)).body);
      expect(record.channel).toBe('acc_2_mps2');
      expect(Math.abs(record.analysis.frequencyHz! / pier.frequencyHz - 1)).toBeLessThan(5e-4);
      expect(Math.abs(record.analysis.dampingRatio! / pier.dampingRatio - 1)).toBeLessThan(0.03);
    }
    const bad = await upload(engineer, decayCsv([deck]), { structureId, condition: 'damper-locked', channel: 'acc_9' }).expect(400);
    expect(apiErrorSchema.parse(bad.body).error.issues[0].path).toBe('channel');
  });

  it.each([
    ['semicolon', ';'],
    ['tab', '\t'],
  ])('reads a %s-separated file', async (_name, separator) => {
    const record = siteRecordSchema.parse((await upload(engineer, decayCsv([deck], { separator }), { structureId, condition: 'without-damper' }).expect(201)).body);
    expect(Math.abs(record.analysis.frequencyHz! / deck.frequencyHz - 1)).toBeLessThan(5e-4);
  });

  it('reads a single column with sampleRateHz, and asks for the rate without it', async () => {
    const samples = decayRecord(deck, 60, 11, { noiseStd: 1e-4, quietS: 2 });
    const file = ['acc_mps2', ...Array.from(samples, (a) => a.toPrecision(7))].join('\n');
    const record = siteRecordSchema.parse((await upload(engineer, file, { structureId, condition: 'without-damper', sampleRateHz: String(rateHz) }).expect(201)).body);
    expect(record.sampleRateHz).toBe(rateHz);
    expect(Math.abs(record.analysis.frequencyHz! / deck.frequencyHz - 1)).toBeLessThan(5e-4);
    expectFileError((await upload(engineer, file, { structureId, condition: 'without-damper' }).expect(400)).body, /sampleRateHz/);
  });
});

describe('refused uploads store nothing', () => {
  it('answers 413 for a file over 20 MB', async () => {
    const before = await storedCount();
    const big = Buffer.alloc(20 * 1024 * 1024 + 10, 0x31);
    const response = await upload(engineer, big, { structureId, condition: 'without-damper' });
    expect(response.status).toBe(413);
    expect(apiErrorSchema.parse(response.body).error.issues[0].path).toBe('file');
    expect(await storedCount()).toBe(before);
  });

  it('names file with the row and column of a binary file, a non-number, an uneven step and too few rows', async () => {
    const before = await storedCount();
    const good = decayCsv([deck]).split('\n');
    const notANumber = [...good];
    notANumber[100] = notANumber[100].replace(/,.*$/, ',n/a');
    const uneven = [...good];
    uneven[200] = uneven[200].replace(/^[^,]*/, (199 / rateHz + 0.3 / rateHz).toFixed(4));
    const cases: [string, string | Buffer, RegExp][] = [
      ['binary', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0xff, 0xfe, 0x00, 0x01]), /binary/],
      ['non-number', notANumber.join('\n'), /row 101, column "acc_1_mps2": "n\/a" is not a number/],
      ['uneven steps', uneven.join('\n'), /row 201, column "time_s": the time step/],
      ['too few rows', good.slice(0, 30).join('\n'), /29 data rows/],
    ];
    for (const [name, file, pattern] of cases) {
      const response = await upload(engineer, file, { structureId, condition: 'without-damper' });
      expect(response.status, name).toBe(400);
      expectFileError(response.body, pattern);
    }
    expect(await storedCount()).toBe(before);
  });

  it('names the other fields: condition, structureId, a mode of another structure, bandHz, a missing file', async () => {
    const before = await storedCount();
    const file = decayCsv([deck]);
    const cases: [Record<string, string>, string][] = [
      [{ structureId, condition: 'after-lunch' }, 'condition'],
      [{ structureId: '00000000-0000-4000-8000-000000000000', condition: 'with-damper' }, 'structureId'],
      [{ structureId, modeId: otherStructureModeId, condition: 'with-damper' }, 'modeId'],
      [{ structureId, condition: 'with-damper', bandHz: '[4, 1]' }, 'bandHz'],
      [{ structureId, condition: 'with-damper', bandHz: 'one to four' }, 'bandHz'],
    ];
    for (const [fields, path] of cases) {
      const response = await upload(engineer, file, fields).expect(400);
      expect(apiErrorSchema.parse(response.body).error.issues.map((i) => i.path), path).toContain(path);
    }
    const noFile = await engineer.post(`/api/projects/${projectId}/site-records`).field('structureId', structureId).field('condition', 'with-damper').expect(400);
    expect(apiErrorSchema.parse(noFile.body).error.issues[0].path).toBe('file');
    expect(await storedCount()).toBe(before);
  });
});

describe('roles and organisations', () => {
  it('lets a fabricator upload; refuses owner and viewer (403); every role reads', async () => {
    await upload(fabricator, decayCsv([deck]), { structureId, condition: 'without-damper' }).expect(201);
    for (const agent of [owner, viewer]) await upload(agent, decayCsv([deck]), { structureId, condition: 'without-damper' }).expect(403);
    const list = siteRecordListSchema.parse((await viewer.get(`/api/projects/${projectId}/site-records`).expect(200)).body);
    expect(list.siteRecords.some((r) => r.id === first.id)).toBe(true);
    expect(JSON.stringify(list)).not.toContain('fileBytes');
    await viewer.delete(`/api/projects/${projectId}/site-records/${first.id}`).expect(403);
    await fabricator.delete(`/api/projects/${projectId}/site-records/${first.id}`).expect(403);
  });

  it('hides a record from another organisation (404)', async () => {
    await outsider.get(`/api/projects/${projectId}/site-records/${first.id}`).expect(404);
    await outsider.get(`/api/projects/${projectId}/site-records`).expect(404);
    await upload(outsider, decayCsv([deck]), { structureId, condition: 'without-damper' }).expect(404);
    await outsider.post(`/api/projects/${projectId}/site-records/${first.id}/analyse`).send({}).expect(404);
    await outsider.delete(`/api/projects/${projectId}/site-records/${first.id}`).expect(404);
    await engineer.get(`/api/projects/${t.outsiderProjectId}/site-records/${first.id}`).expect(404);
  });

  it('refuses a JSON body on the upload route (415) and keeps JSON-only elsewhere', async () => {
    await engineer.post(`/api/projects/${projectId}/site-records`).send({ structureId }).expect(415);
    await engineer.post(`/api/projects/${projectId}/structures`).field('name', 'x').expect(415);
  });
});

describe('new analysis, comparison and re-tune', () => {
  it('analyses again with another band and method, and versions the record', async () => {
    const again = siteRecordSchema.parse(
      (await engineer.post(`/api/projects/${projectId}/site-records/${first.id}/analyse`).send({ bandHz: [1, 2.5], method: 'spectrum', version: first.version }).expect(200)).body,
    );
    expect(again.version).toBe(first.version + 1);
    expect(again.analysis.bandHz).toEqual([1, 2.5]);
    expect(again.analysis.method).toBe('spectrum');
    expect(again.analysis.methodChosenBy).toBe('request');
    await engineer.post(`/api/projects/${projectId}/site-records/${first.id}/analyse`).send({ method: 'decay', version: first.version }).expect(409);
    const back = siteRecordSchema.parse((await engineer.post(`/api/projects/${projectId}/site-records/${first.id}/analyse`).send({ method: 'decay' }).expect(200)).body);
    expect(back.analysis.method).toBe('decay');
    first = back;
    const bad = await engineer.post(`/api/projects/${projectId}/site-records/${first.id}/analyse`).send({ bandHz: [0.5, 40] }).expect(400);
    expect(apiErrorSchema.parse(bad.body).error.issues[0].path).toBe('bandHz');
    await viewer.post(`/api/projects/${projectId}/site-records/${first.id}/analyse`).send({}).expect(403);
  });

  it('compares with the design mode, and gives the added damping against the design mode, then against a without-damper record', async () => {
    const comparison = first.comparison!;
    expect(comparison.modeId).toBe(modeId);
    expect(comparison.design).toEqual({ frequencyHz: 2, dampingRatio: 0.005 });
    expect(comparison.frequencyShiftPercent).toBeCloseTo(((first.analysis.frequencyHz! - 2) / 2) * 100, 10);
    expect(comparison.dampingShiftPercent).toBeCloseTo(((first.analysis.dampingRatio! - 0.005) / 0.005) * 100, 10);
    expect(comparison.addedDamping).toBeNull();

    // Delete the without-damper record first, so that the with-damper record is measured against the design mode.
    await engineer.delete(`/api/projects/${projectId}/site-records/${first.id}`).expect(204);
    await engineer.get(`/api/projects/${projectId}/site-records/${first.id}`).expect(404);
    const withDamper = siteRecordSchema.parse((await upload(fabricator, decayCsv([damped], { seed: 21 }), { structureId, modeId, condition: 'with-damper' }).expect(201)).body);
    expect(withDamper.comparison!.addedDamping).toMatchObject({ reference: 'design-mode', referenceDampingRatio: 0.005, referenceRecordId: null });
    expect(withDamper.comparison!.addedDamping!.dampingRatio).toBeCloseTo(withDamper.analysis.dampingRatio! - 0.005, 12);

    const bare = siteRecordSchema.parse((await upload(engineer, decayCsv([deck], { seed: 31 }), { structureId, modeId, condition: 'without-damper' }).expect(201)).body);
    const reread = siteRecordSchema.parse((await viewer.get(`/api/projects/${projectId}/site-records/${withDamper.id}`).expect(200)).body);
    expect(reread.comparison!.addedDamping).toMatchObject({ reference: 'without-damper-record', referenceRecordId: bare.id });
    expect(reread.comparison!.addedDamping!.dampingRatio).toBeCloseTo(withDamper.analysis.dampingRatio! - bare.analysis.dampingRatio!, 12);
    // About 0.035 − 0.012 = 0.023 from the oscillators the test made.
    expect(reread.comparison!.addedDamping!.dampingRatio).toBeGreaterThan(0.02);
    expect(reread.comparison!.addedDamping!.dampingRatio).toBeLessThan(0.026);
  });

  it('re-tunes against the Den Hartog closed form f_a = f_s / (1 + μ) and the single-DOF spring and mass rules', async () => {
    const list = siteRecordListSchema.parse((await engineer.get(`/api/projects/${projectId}/site-records`).expect(200)).body);
    const record = list.siteRecords.find((r) => r.condition === 'without-damper' && r.modeId === modeId)!;
    const massKg = 600;
    const springRateNPerM = massKg * (2 * Math.PI * 1.95) ** 2;
    const body = { massRatio: 0.02, method: 'den-hartog', tmdMassKg: massKg, springRateNPerM, tuningRangeRatio: 0.1 };
    const answer = retuneResponseSchema.parse((await viewer.post(`/api/projects/${projectId}/site-records/${record.id}/retune`).send(body).expect(200)).body);
    const fs = record.analysis.frequencyHz!;
    // Den Hartog, Mechanical Vibrations, 4th ed. 1956 (from memory): optimum frequency ratio 1/(1+μ).
    const target = fs / 1.02;
    expect(answer.targetFrequencyHz).toBeCloseTo(target, 10);
    expect(answer.currentFrequencyHz).toBeCloseTo(1.95, 10);
    // Single-DOF f = √(k/m)/2π: k′ = k (f′/f)², m′ = m (f/f′)² (Chopra, Dynamics of Structures, ch. 2).
    expect(answer.springRateAtSameMassNPerM).toBeCloseTo(springRateNPerM * (target / 1.95) ** 2, 4);
    expect(answer.massAtSameSpringsKg).toBeCloseTo(massKg * (1.95 / target) ** 2, 8);
    expect(answer.withinTuningRange).toBe(Math.abs(target / 1.95 - 1) <= 0.1);
    const bad = await engineer.post(`/api/projects/${projectId}/site-records/${record.id}/retune`).send({ massRatio: -1, method: 'den-hartog' }).expect(400);
    expect(apiErrorSchema.parse(bad.body).error.issues[0].path).toBe('massRatio');
    // A with-damper record shows structure and damper together: not the structure to tune to.
    const coupled = list.siteRecords.find((r) => r.condition === 'with-damper')!;
    const refused = await engineer.post(`/api/projects/${projectId}/site-records/${coupled.id}/retune`).send({ massRatio: 0.02, method: 'den-hartog' }).expect(409);
    expect(apiErrorSchema.parse(refused.body).error.code).toBe('not_the_bare_structure');
  });
});

describe('demo site records', () => {
  it('are invented decays whose analysis finds the oscillator the seed made', async () => {
    for (const record of demoSiteRecords) {
      expect(record.notes).toMatch(/^Invented demo record/);
      const { analysis } = await analyseRecord({ fileBytes: Buffer.from(demoSiteRecordCsv(record)) });
      expect(analysis.method).toBe('decay');
      expect(Math.abs(analysis.frequencyHz! / record.oscillator.frequencyHz - 1)).toBeLessThan(2e-3);
      expect(Math.abs(analysis.dampingRatio! / record.oscillator.dampingRatio - 1)).toBeLessThan(0.1);
    }
  });
});
