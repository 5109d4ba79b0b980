/**
 * As-built records of an approved damper against a real PostgreSQL: 409 before approval, who may record and who may
 * only read, another organisation's 404, 400 naming the field, records appended (earlier ones kept, newest first),
 * and the comparison against the hardware sheet's own rows by hand formulas: deviation = measured − design (and % of
 * design); f = (1/2π) √(k/m), the single-degree-of-freedom relation (Chopra, "Dynamics of Structures", ch. 2, from
 * memory); mass ratio μ = Σ m / M (PRODUCT conventions). The footbridge numbers are invented test inputs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { asBuiltRecordListSchema, asBuiltRecordSchema } from '../../shared/contracts/as-built';
import { hardwareSheetSchema, signOffSchema, type SignOff } from '../../shared/contracts/sign-offs';
import { historyListSchema } from '../../shared/contracts/history';
import { roles, type Role } from '../../shared/contracts/roles';
import { createTestVariant, newTestDesignProject, testMode } from '../support/design-fixture';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;

// Test inputs (invented).
// The design of tests/support/design-fixture.ts, a Den Hartog variant on its crowd load case.
const mode = testMode;
const massRatio = 0.02;
const unitCount = 2;

let signOff: SignOff;
let base: string;
/** The hardware sheet's value of a row. */
let sheet: (quantity: string) => number;

const close = (actual: number, expected: number, relative = 1e-9) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(relative * Math.abs(expected));

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
  const agent = agents.engineer;
  const ids = await newTestDesignProject(agent, 'As-built test footbridge');
  const { projectId } = ids;
  const variant = await createTestVariant(agent, ids, {
    loadCaseIds: [ids.crowdId],
    massRatio,
    unitCount
  });
  const submitted = await agent.post(`/api/projects/${projectId}/sign-offs`).send({ variantId: variant.id });
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(201);
  signOff = signOffSchema.parse(submitted.body);
  base = `/api/projects/${projectId}/sign-offs/${signOff.id}/as-built`;
});

afterAll(async () => {
  await t?.close();
});

const onDesign = () => [
  { unitNumber: 1, movingMassKg: sheet('Moving mass per unit') },
  { unitNumber: 2, movingMassKg: sheet('Moving mass per unit') },
];

describe('as-built records', () => {
  it('are refused with 409 before approval, and nothing is stored', async () => {
    const posted = await agents.fabricator.post(base).send({ units: [{ unitNumber: 1, movingMassKg: 300 }] });
    expect(posted.status).toBe(409);
    expect(apiErrorSchema.parse(posted.body).error.code).toBe('sign_off_not_approved');
    expect((await agents.viewer.get(base)).status).toBe(409);

    const approved = await agents.owner.post(`/api/projects/${signOff.projectId}/sign-offs/${signOff.id}/approve`).send({ comment: 'Build it.' });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(asBuiltRecordListSchema.parse((await agents.viewer.get(base).expect(200)).body).records).toEqual([]);
    const rows = hardwareSheetSchema.parse((await agents.fabricator.get(`/api/projects/${signOff.projectId}/sign-offs/${signOff.id}/hardware-sheet`).expect(200)).body).rows;
    sheet = (quantity: string) => {
      const value = rows.find((r) => r.quantity === quantity)?.value;
      expect(typeof value, quantity).toBe('number');
      return value as number;
    };
  });

  it('may be recorded by the fabricator, an engineer or an admin; the owner and the viewer only read them (403)', async () => {
    for (const role of ['owner', 'viewer'] as const) {
      const response = await agents[role].post(base).send({ units: onDesign() });
      expect(response.status, role).toBe(403);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('forbidden');
    }
    for (const role of ['fabricator', 'engineer', 'admin'] as const) {
      const response = await agents[role].post(base).send({ units: onDesign(), note: `by ${role}` });
      expect(response.status, `${role}: ${JSON.stringify(response.body)}`).toBe(201);
      const record = asBuiltRecordSchema.parse(response.body);
      expect(record.recordedBy).toBe(t.people[role].id);
      expect(record.recordedByName).toBe(`A ${role}`);
      expect(response.headers.location).toBe(`${base}/${record.id}`);
      expect(record.comparison.warnings).toEqual([]);
    }
    for (const role of roles) expect(asBuiltRecordListSchema.parse((await agents[role].get(base).expect(200)).body).records, role).toHaveLength(3);
    // Each record is one entry of the project's history, by the person who recorded it (docs/decisions/0020-history.md).
    const history = historyListSchema.parse(
      (await agents.viewer.get(`/api/projects/${signOff.projectId}/history`).query({ entity: 'as-built-record' }).expect(200)).body,
    );
    expect(history.events.map((e) => [e.action, e.by?.id])).toEqual(
      (['admin', 'engineer', 'fabricator'] as const).map((role) => ['create', t.people[role].id]),
    );
    expect(history.events[2].changes.note).toEqual({ after: 'by fabricator' });
  });

  it("is 404 for another organisation's project or sign-off, and for a sign-off that does not exist", async () => {
    expect((await outsiderAgent.get(base)).status).toBe(404);
    expect((await outsiderAgent.post(base).send({ units: onDesign() })).status).toBe(404);
    const outsiderBase = `/api/projects/${t.outsiderProjectId}/sign-offs/${signOff.id}/as-built`;
    expect((await outsiderAgent.get(outsiderBase)).status).toBe(404);
    const missing = `/api/projects/${signOff.projectId}/sign-offs/00000000-0000-4000-8000-000000000000/as-built`;
    expect((await agents.fabricator.get(missing)).status).toBe(404);
    expect((await agents.fabricator.post(missing).send({ units: onDesign() })).status).toBe(404);
    const malformed = await agents.fabricator.get(`/api/projects/${signOff.projectId}/sign-offs/not-an-id/as-built`);
    expect(malformed.status).toBe(400);
    expect(apiErrorSchema.parse(malformed.body).error.issues[0].path).toBe('signOffId');
  });

  it('answers 400 naming the field and the rule, and stores nothing', async () => {
    const before = asBuiltRecordListSchema.parse((await agents.fabricator.get(base).expect(200)).body).records;
    const cases: [unknown, string, RegExp][] = [
      [{ units: [{ unitNumber: 1, movingMassKg: 300 }, { unitNumber: 2, movingMassKg: -5 }] }, 'units.1.movingMassKg', /between 0\.1 and 1000000 kg/],
      [{ units: [{ unitNumber: 3, movingMassKg: 300 }] }, 'units.0.unitNumber', /between 1 and 2: the hardware sheet has 2 units/],
      [{ units: [{ unitNumber: 1, movingMassKg: 300 }, { unitNumber: 1, movingMassKg: 301 }] }, 'units.1.unitNumber', /repeats unit 1/],
      [{ units: [{ unitNumber: 1, movingMassKg: 300, springRateNPerM: 'stiff' }] }, 'units.0.springRateNPerM', /must be a number in N\/m/],
      [{ units: [{ unitNumber: 1, movingMassKg: 300, frequencyHz: 0 }] }, 'units.0.frequencyHz', /between 0\.01 and 100 Hz/],
      [{ units: [{ unitNumber: 1, movingMassKg: 300, measuredAt: 'yesterday' }] }, 'units.0.measuredAt', /YYYY-MM-DD/],
      [{ units: [{ unitNumber: 1, movingMassKg: 300, massKg: 300 }] }, 'units.0.massKg', /not a known field/],
      [{ units: [] }, 'units', /at least one unit/],
      [{ units: [{ unitNumber: 1, movingMassKg: 300 }], note: 'x\u0000' }, 'note', /NUL/],
    ];
    for (const [body, path, rule] of cases) {
      const response = await agents.fabricator.post(base).send(body as object);
      expect(response.status, path).toBe(400);
      const error = apiErrorSchema.parse(response.body).error;
      expect(error.code).toBe('invalid_request');
      const issue = error.issues.find((i) => i.path === path);
      expect(issue, `${path}: ${JSON.stringify(error.issues)}`).toBeDefined();
      expect(issue!.message).toMatch(rule);
      expect(issue!.message.startsWith(`${path}: `)).toBe(true);
    }
    expect(asBuiltRecordListSchema.parse((await agents.fabricator.get(base).expect(200)).body).records).toEqual(before);
  });

  it("compares each unit with the hardware sheet's rows, and warns in plain words outside the tuning range", async () => {
    const mDesign = sheet('Moving mass per unit');
    const kDesign = sheet('Spring rate per unit');
    const fDesign = sheet('Target frequency');
    const fHigh = sheet('Frequency, high end');
    const m1 = mDesign * 1.04;
    const k1 = kDesign * 0.97;
    const f2 = fHigh * 1.05;
    const response = await agents.fabricator.post(base).send({
      units: [
        { unitNumber: 2, movingMassKg: mDesign, frequencyHz: f2, measuredAt: '2026-11-30', note: 'after the first shaker run' },
        { unitNumber: 1, movingMassKg: m1, springRateNPerM: k1, frequencyHz: fDesign },
      ],
      note: 'Site visit (invented test record)',
    });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const record = asBuiltRecordSchema.parse(response.body);
    expect(record.note).toBe('Site visit (invented test record)');
    expect(record.units.find((u) => u.unitNumber === 2)).toEqual({ unitNumber: 2, movingMassKg: mDesign, frequencyHz: f2, measuredAt: '2026-11-30', note: 'after the first shaker run' });
    const c = record.comparison;
    expect(c.units.map((u) => u.unitNumber)).toEqual([1, 2]);
    const [u1, u2] = c.units;
    close(u1.movingMassKg.absolute, m1 - mDesign);
    close(u1.movingMassKg.percent, 4);
    close(u1.springRateNPerM!.percent, -3);
    close(u1.impliedFrequencyHz!.measuredValue, Math.sqrt(k1 / m1) / (2 * Math.PI)); // f = (1/2π) √(k/m)
    expect(u1.withinTuningRange).toBe(true);
    close(u2.frequencyHz!.absolute, f2 - fDesign);
    expect(u2.frequencyRange?.verdict).toBe('above');
    expect(u2.withinTuningRange).toBe(false);
    expect(c.unitsOutsideRange).toEqual([2]);
    expect(c.warnings).toHaveLength(1);
    expect(c.warnings[0]).toMatch(/^Unit 2: measured [\d.]+ Hz is above the tuning range [\d.]+–[\d.]+ Hz; add mass or soften the springs$/);
    // μ built = Σ m / M, against the design's μ.
    close(c.builtMassRatio!, (m1 + mDesign) / mode.modalMassKg);
    close(c.design.massRatio, massRatio);
  });

  it('keeps every record, newest first, and leaves the earlier ones as they were', async () => {
    const list = asBuiltRecordListSchema.parse((await agents.viewer.get(base).expect(200)).body).records;
    expect(list).toHaveLength(4);
    expect(list[0].note).toBe('Site visit (invented test record)');
    expect(list.slice(1).map((r) => r.note)).toEqual(['by admin', 'by engineer', 'by fabricator']);
    const times = list.map((r) => r.recordedAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(list[3].units).toEqual(onDesign());
  });
});
