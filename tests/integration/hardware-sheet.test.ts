/**
 * The fabricator's hardware sheet of an approved sign-off, against a real PostgreSQL: 409 before approval, every role
 * of the organisation reads it, another organisation gets 404, and the CSV's and the PDF's numbers are those of the
 * approved snapshot, checked against the standard TMD relations (Den Hartog 1956, "Mechanical Vibrations", 4th ed.;
 * common practice for the hardware): m = μ M, k = m (2π f_a)², c = 2 ζ_a m ω_a, static deflection g / ω_a² with
 * g = 9.80665 m/s² (standard gravity, CGPM 1901). The footbridge numbers are invented test inputs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { PDFParse } from 'pdf-parse';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { hardwareSheetSchema, signOffSchema, type SignOff } from '../../shared/contracts/sign-offs';
import { variantSchema } from '../../shared/contracts/variants';
import { roles, type Role } from '../../shared/contracts/roles';
import { HARDWARE_SHEET_CAUTION } from '../../shared/compute/hardware-sheet';
import { createTestVariant, newTestDesignProject, testMode } from '../support/design-fixture';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;

// Test inputs (invented).
const projectName = 'Sheet test footbridge, "north" span';
// The design of tests/support/design-fixture.ts, a Den Hartog variant on its crowd load case.
const mode = testMode;
const massRatio = 0.02;
const unitCount = 2;
const springsPerUnit = 4;

let base: string;
let signOff: SignOff;

/** Relative agreement to four significant figures. */
const close = (actual: number, expected: number) => expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(5e-5);

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
  const agent = agents.engineer;
  const ids = await newTestDesignProject(agent, projectName);
  const { projectId } = ids;
  const variant = await createTestVariant(agent, ids, {
    loadCaseIds: [ids.crowdId],
    massRatio,
    unitCount,
    hardware: { springsPerUnit },
  });
  const submitted = await agent.post(`/api/projects/${projectId}/sign-offs`).send({ variantId: variant.id });
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(201);
  signOff = signOffSchema.parse(submitted.body);
  base = `/api/projects/${projectId}/sign-offs/${signOff.id}/hardware-sheet`;
});

afterAll(async () => {
  await t?.close();
});

describe('hardware sheet', () => {
  it('is refused with 409 before approval', async () => {
    for (const suffix of ['', '.csv', '.pdf']) {
      const response = await agents.fabricator.get(`${base}${suffix}`);
      expect(response.status, suffix).toBe(409);
      const error = apiErrorSchema.parse(response.body).error;
      expect(error.code).toBe('sign_off_not_approved');
      expect(error.message).toContain('approved');
    }
    const approved = await agents.owner.post(`/api/projects/${signOff.projectId}/sign-offs/${signOff.id}/approve`).send({ comment: 'Agreed, build it.' });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    signOff = signOffSchema.parse(approved.body);
  });

  it('every role of the organisation reads it; another organisation gets 404', async () => {
    for (const role of roles) {
      expect((await agents[role].get(base)).status, role).toBe(200);
      expect((await agents[role].get(`${base}.csv`)).status, role).toBe(200);
    }
    for (const suffix of ['', '.csv', '.pdf']) expect((await outsiderAgent.get(`${base}${suffix}`)).status, suffix).toBe(404);
  });

  it("the CSV's numbers are the approved snapshot's, by the standard TMD relations", async () => {
    const response = await agents.fabricator.get(`${base}.csv`).buffer(true);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename="?Sheet-test-footbridge-north-span-hardware-sheet-[0-9a-f]{8}-\d{4}-\d{2}-\d{2}\.csv"?$/);
    // Read back by an independent RFC 4180 parser (papaparse).
    const parsedCsv = Papa.parse<string[]>(response.text, { skipEmptyLines: true });
    expect(parsedCsv.errors).toEqual([]);
    const records = parsedCsv.data;
    expect(records[0]).toEqual(['section', 'quantity', 'value', 'unit', 'note']);
    expect(records.every((r) => r.length === 5)).toBe(true);
    const value = (quantity: string) => {
      const row = records.find((r) => r[1] === quantity);
      expect(row, quantity).toBeDefined();
      return row as string[];
    };
    expect(value('Project')[2]).toBe(projectName);

    const snapshot = signOff.snapshot;
    const tmd = snapshot.variant.result!.tmd;
    const mKg = massRatio * mode.modalMassKg; // m = μ M
    const wA = 2 * Math.PI * tmd.frequencyHz;
    const g = 9.80665;
    close(Number(value('Total moving mass')[2]), mKg);
    close(tmd.massKg, mKg);
    close(Number(value('Moving mass per unit')[2]), mKg / unitCount);
    close(Number(value('Target frequency')[2]), tmd.frequencyHz);
    close(Number(value('Damping ratio')[2]), tmd.dampingRatio);
    expect(value('Damping ratio')[4]).toContain('f_a');
    close(Number(value('Spring rate per unit')[2]), (mKg * wA * wA) / unitCount); // k = m ω_a²
    expect(value('Spring rate per unit')[3]).toBe('N/m');
    close(Number(value('Spring rate per spring')[2]), (mKg * wA * wA) / unitCount / springsPerUnit);
    close(Number(value('Damper coefficient per unit')[2]), (2 * tmd.dampingRatio * mKg * wA) / unitCount); // c = 2 ζ_a m ω_a
    close(Number(value('Static deflection under the moving mass')[2]), (g / (wA * wA)) * 1000); // mm
    expect(Number(value('Number of units')[2])).toBe(unitCount);
    close(Number(value('Modal mass')[2]), mode.modalMassKg);
    close(Number(value('Mode frequency')[2]), mode.frequencyHz);
    // The design stroke is the snapshot's, never recomputed.
    const entry = snapshot.variant.result!.loadCases[0].hardware[0];
    close(Number(value('Design stroke')[2]), entry.designStrokeM * 1000);
    close(Number(value('Design stroke')[2]), entry.strokeMarginFactor * entry.maximumStrokeM * 1000);
    expect(value('Approved by')[4]).toBe(t.people.owner.email);
    expect(value('Comment')[2]).toBe('Agreed, build it.');
    expect(value('Caution')[2]).toBe(HARDWARE_SHEET_CAUTION);

    // The JSON rows are the same.
    const sheet = hardwareSheetSchema.parse((await agents.viewer.get(base).expect(200)).body);
    expect(sheet.rows.find((r) => r.quantity === 'Total moving mass')?.value).toBe(entry.movingMassKg);
  });

  it('the PDF parses and carries the project, the moving mass, the spring rate and the caution', async () => {
    const response = await agents.viewer
      .get(`${base}.pdf`)
      .buffer(true)
      .parse((res, callback) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => callback(null, Buffer.concat(chunks)));
      });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(response.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    const sheet = hardwareSheetSchema.parse((await agents.viewer.get(base).expect(200)).body);
    const shown = (quantity: string) => String(Number((sheet.rows.find((r) => r.quantity === quantity)?.value as number).toPrecision(6)));
    expect(text).toContain(projectName);
    expect(text).toContain(shown('Total moving mass'));
    expect(text).toContain(shown('Spring rate per unit'));
    expect(text).toContain('judgement of a qualified engineer');
    expect(text).toContain('licensed practice govern');
  });
});

describe('the hardware sheet rests on the approval alone', () => {
  it('keeps the approver and project names of the decision when the owner and the project are renamed later', async () => {
    const before = hardwareSheetSchema.parse((await agents.fabricator.get(base).expect(200)).body);
    const approvedBy = before.rows.find((r) => r.quantity === 'Approved by');
    expect(approvedBy).toMatchObject({ value: 'A owner', note: t.people.owner.email });
    const csvBefore = (await agents.fabricator.get(`${base}.csv`).buffer(true).expect(200)).text;

    await t.ctx.pool.query(`update users set name = 'Renamed owner', email = 'renamed-owner@a.test' where id = $1`, [t.people.owner.id]);
    await t.ctx.pool.query(`update projects set name = 'Renamed project' where id = $1`, [signOff.projectId]);

    const after = hardwareSheetSchema.parse((await agents.fabricator.get(base).expect(200)).body);
    expect(after).toEqual(before);
    expect(after.projectName).toBe(projectName);
    expect((await agents.fabricator.get(`${base}.csv`).buffer(true).expect(200)).text).toBe(csvBefore);
    // The sign-off keeps the decider as they were, too.
    const read = signOffSchema.parse((await agents.viewer.get(`/api/projects/${signOff.projectId}/sign-offs/${signOff.id}`).expect(200)).body);
    expect(read).toMatchObject({ decidedByName: 'A owner', decidedByEmail: t.people.owner.email });
  });

  it('an approved result from an earlier engine version is served as approved and says so; the sheet uses the snapshot', async () => {
    const variantUrl = `/api/projects/${signOff.projectId}/variants/${signOff.variantId}`;
    const current = variantSchema.parse((await agents.viewer.get(variantUrl).expect(200)).body);
    expect(current.result?.stale).toBe(false);
    const runningVersion = current.result!.engineVersion;
    const olderVersion = '2000.01-0';
    // An approval made under an earlier engine: the frozen row and the snapshot carry that engine's version. The
    // database's freeze is stepped round for this one change (session_replication_role skips the triggers).
    const client = await t.ctx.pool.connect();
    try {
      await client.query('begin');
      await client.query(`set local session_replication_role = replica`);
      await client.query(`update tuning_variants set engine_version = $2 where id = $1`, [signOff.variantId, olderVersion]);
      await client.query(
        `update sign_offs set snapshot = jsonb_set(jsonb_set(snapshot, '{engineVersion}', to_jsonb($2::text)), '{variant,result,engineVersion}', to_jsonb($2::text)) where id = $1`,
        [signOff.id, olderVersion],
      );
      await client.query('commit');
    } finally {
      client.release();
    }

    const served = variantSchema.parse((await agents.viewer.get(variantUrl).expect(200)).body);
    expect(served.result?.engineVersion).toBe(olderVersion);
    expect(served.result?.engineVersion).not.toBe(runningVersion);
    // Not recomputed (frozen): the same figures, and `stale` says that the running engine did not compute them.
    expect(served.result?.stale).toBe(true);
    expect(served.result?.loadCases).toEqual(current.result?.loadCases);
    expect(served.result?.tmd).toEqual(current.result?.tmd);
    const { rows } = await t.ctx.pool.query<{ engine_version: string }>(`select engine_version from tuning_variants where id = $1`, [signOff.variantId]);
    expect(rows[0].engine_version).toBe(olderVersion);

    const sheet = hardwareSheetSchema.parse((await agents.fabricator.get(base).expect(200)).body);
    expect(sheet.rows.find((r) => r.quantity === 'Engine version')?.value).toBe(olderVersion);
    expect(sheet.rows.find((r) => r.quantity === 'Total moving mass')?.value).toBe(signOff.snapshot.variant.result!.loadCases[0].hardware[0].movingMassKg);
  });
});
