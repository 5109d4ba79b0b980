/**
 * The engineer's design report of a tuning variant (GET …/variants/:variantId/report.pdf) against a real PostgreSQL:
 * every role of the organisation reads it, other organisations and unknown variants get 404, a variant whose inputs
 * the engine refuses gets 409; the PDF parses (pdf-parse, an independent reader) and carries the stored result's
 * numbers as the report prints them (four significant figures), the tuning method, every load case, the plots' axis
 * titles and the caution. The footbridge numbers are invented test inputs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { PDFParse } from 'pdf-parse';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { projectSchema } from '../../shared/contracts/projects';
import { roles, type Role } from '../../shared/contracts/roles';
import { variantSchema, type Variant } from '../../shared/contracts/variants';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;

// Test inputs (invented).
const projectName = 'Report test footbridge';
const mode = { label: 'Report test vertical mode', direction: 'vertical', frequencyHz: 1.93, modalMassKg: 36_500, dampingRatio: 0.006, modeShapeMean: 0.62 };
const crowd = { name: 'Report test crowd', spec: { kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 180 } };
const walker = { name: 'Report test walker', spec: { kind: 'walker' } };
const crossing = { name: 'Report test crossing', spec: { kind: 'moving-walker', spanM: 36 } };
const criteriaSpec = { set: 'setra', class: 'mean' };
const massRatio = 0.025;

interface Ids {
  projectId: string;
  structureId: string;
  modeId: string;
  modeVersion: number;
  loadCaseIds: string[];
  criteriaId: string;
}

async function newProject(name: string, agent = agents.engineer): Promise<Ids> {
  const projectId = projectSchema.parse((await agent.post('/api/projects').send({ name, kind: 'footbridge' }).expect(201)).body).id;
  const structureId = (await agent.post(`/api/projects/${projectId}/structures`).send({ name: 'Report test span', kind: 'footbridge-span' }).expect(201)).body.id as string;
  const modeBody = (await agent.post(`/api/projects/${projectId}/structures/${structureId}/modes`).send(mode).expect(201)).body as { id: string; version: number };
  const loadCaseIds: string[] = [];
  for (const lc of [crowd, walker, crossing]) loadCaseIds.push((await agent.post(`/api/projects/${projectId}/load-cases`).send(lc).expect(201)).body.id as string);
  const criteriaId = (await agent.post(`/api/projects/${projectId}/comfort-criteria`).send({ name: 'Report test criteria', spec: criteriaSpec }).expect(201)).body.id as string;
  return { projectId, structureId, modeId: modeBody.id, modeVersion: modeBody.version, loadCaseIds, criteriaId };
}

async function newVariant(ids: Ids, loadCaseIds = ids.loadCaseIds, agent = agents.engineer): Promise<Variant> {
  const created = await agent.post(`/api/projects/${ids.projectId}/variants`).send({
    name: 'Report test Den Hartog 2.5 %',
    modeId: ids.modeId,
    loadCaseIds,
    criteriaId: ids.criteriaId,
    massRatio,
    tuning: { method: 'den-hartog' },
    unitCount: 2,
  });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  return variantSchema.parse(created.body);
}

const reportPath = (ids: Pick<Ids, 'projectId'>, variantId: string) => `/api/projects/${ids.projectId}/variants/${variantId}/report.pdf`;

/** The answer's body as bytes (supertest leaves application/pdf unparsed otherwise). */
type BodyParser = Extract<Parameters<ReturnType<Agent['get']>['parse']>[0], (res: never, callback: never) => void>;
const asBuffer: BodyParser = (res, callback) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  stream.on('end', () => callback(null, Buffer.concat(chunks)));
};

async function pdfText(bytes: Buffer): Promise<{ text: string; pages: number }> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  const result = await parser.getText();
  await parser.destroy();
  return { text: result.text.replace(/\s+/g, ' '), pages: result.total };
}

/**
 * The report's rule for numbers, written out independently: four significant figures with trailing zeros below 1000,
 * whole numbers from 1000 on.
 */
const four = (value: number) => (Math.abs(value) >= 1000 ? String(Math.round(value)) : value.toPrecision(4));

let ids: Ids;
let variant: Variant;
/** The same damper under the crowd alone: a lighter report for the checks that read it once per role. */
let crowdOnly: Variant;

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
  ids = await newProject(projectName);
  variant = await newVariant(ids);
  crowdOnly = await newVariant(ids, ids.loadCaseIds.slice(0, 1));
});

afterAll(async () => {
  await t?.close();
});

describe('design report', () => {
  it('every role of the organisation reads it as a PDF file named after the project, variant and revision', async () => {
    for (const role of roles) {
      const response = await agents[role].get(reportPath(ids, crowdOnly.id)).buffer(true).parse(asBuffer);
      expect(response.status, role).toBe(200);
      expect(response.headers['content-type']).toBe('application/pdf');
      expect(response.headers['content-disposition']).toMatch(
        new RegExp(`^attachment; filename="?Report-test-footbridge-Report-test-Den-Hartog-2-5-design-report-${crowdOnly.id.slice(0, 8)}-v${crowdOnly.version}\\.pdf"?$`),
      );
      expect((response.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    }
  });

  it('carries the stored result: mode, mass ratio, method, each load case with its peak, the plot titles and the caution', async () => {
    const response = await agents.viewer.get(reportPath(ids, variant.id)).buffer(true).parse(asBuffer);
    expect(response.status).toBe(200);
    const { text, pages } = await pdfText(response.body as Buffer);
    const stored = variantSchema.parse((await agents.viewer.get(`/api/projects/${ids.projectId}/variants/${variant.id}`).expect(200)).body);
    const result = stored.result!;
    expect(result).not.toBeNull();

    // Header and title block.
    expect(text).toContain(projectName);
    expect(text).toContain(`${stored.name} · version ${stored.version}`);
    expect(text).toContain(`${stored.id.slice(0, 8)}-v${stored.version}`);
    expect(text).toContain(`engine ${result.engineVersion}`);
    expect(text).toContain(`page 1 of ${pages}`);
    expect(text).toContain(`page ${pages} of ${pages}`);

    // Inputs: the mode as stored, typed in.
    expect(text).toContain(`${four(mode.frequencyHz)} Hz`); // 1.930 Hz
    expect(text).toContain(`${four(mode.modalMassKg)} kg`); // 36500 kg
    expect(text).toContain(four(mode.dampingRatio)); // 0.006000
    expect(text).toContain('typed in');
    expect(text).toContain('Sétra 2006');
    expect(text).toContain('traffic class II');

    // Method and damper: Den Hartog (1956), m = μ M (Den Hartog, "Mechanical Vibrations", 1956).
    expect(text).toContain('Den Hartog');
    expect(text).toContain('Mechanical Vibrations (1956)');
    expect(text).toContain(`mass ratio ${four(massRatio)}`); // 0.02500
    expect(text).toContain(`${four(massRatio * mode.modalMassKg)} kg`); // 912.5 kg
    expect(text).toContain(`f_a = ${four(result.tmd.frequencyHz)} Hz`);

    // Every load case with its stored peak, as the report prints it.
    for (const lc of result.loadCases) {
      expect(text).toContain(lc.name);
      expect(text).toContain(`${four(lc.peakAccelerationMPerS2)} m/s² at ${four(lc.atFrequencyHz)} Hz`);
    }
    expect(text).toContain(`${four(result.detuning.worstPeakAccelerationMPerS2)} m/s²`);

    // The plots: axis titles with units (response over the force band, robustness map).
    // The crossing's time history.
    for (const title of ['frequency of the force [Hz]', 'peak acceleration [m/s²]', 'structure frequency [Hz]', 'damper damping ratio, referred to f_a [%]', 'time [s]', 'acceleration [m/s²]']) {
      expect(text).toContain(title);
    }

    // Warnings: the walker's values from memory are flagged.
    expect(text).toContain('FROM MEMORY');
    // The caution: the engine's own, in full, and its gist on every page.
    expect(text).toContain(result.caution);
    expect(text).toContain('judgement of a qualified engineer');
    expect(text).toContain('licensed practice govern');
  });

  it('names where a derived mode came from: the beam with its λ and modal-mass fraction, the lumped model with its mode and DOF', async () => {
    const agent = agents.engineer;
    const walkerOnly = [ids.loadCaseIds[1]];
    // A simply supported uniform beam: λ1 = π and M = m L / 2 (Blevins, "Formulas for Natural Frequency and Mode
    // Shape", 1979); 40 m, 2000 kg/m and EI = 8.3e9 N·m² put f1 = (π / 2L²) √(EI/m) near 2 Hz (invented inputs).
    const beamMode = (
      await agent
        .post(`/api/projects/${ids.projectId}/structures/${ids.structureId}/modes`)
        .send({
          label: 'Report test beam mode',
          direction: 'vertical',
          dampingRatio: 0.006,
          source: { kind: 'beam', support: 'simply-supported', lengthM: 40, bendingStiffnessNM2: 8.3e9, massPerLengthKgPerM: 2000 },
        })
        .expect(201)
    ).body as { id: string; frequencyHz: number; modalMassKg: number };
    const beamVariant = await (async () => {
      const created = await agent.post(`/api/projects/${ids.projectId}/variants`).send({
        name: 'Report test beam variant', modeId: beamMode.id, loadCaseIds: walkerOnly, criteriaId: ids.criteriaId, massRatio, tuning: { method: 'warburton-random' },
      });
      expect(created.status, JSON.stringify(created.body)).toBe(201);
      return variantSchema.parse(created.body);
    })();
    const beamText = (await pdfText((await agents.owner.get(reportPath(ids, beamVariant.id)).buffer(true).parse(asBuffer).expect(200)).body as Buffer)).text;
    expect(beamText).toContain('uniform Euler-Bernoulli beam, simply-supported, mode 1');
    expect(beamText).toContain(`lambda_n = ${four(Math.PI)}`); // 3.142
    expect(beamText).toContain(`M = ${four(0.5)} · m L`); // m L / 2
    expect(beamText).toContain(`${four((Math.PI / (2 * 40 ** 2)) * Math.sqrt(8.3e9 / 2000))} Hz`);
    expect(beamText).toContain(`${four(2000 * 40 * 0.5)} kg`); // 40000 kg
    expect(beamText).toContain('Warburton');

    // A two-mass chain (invented): mode 1 at the free end's DOF.
    const model = (
      await agent
        .post(`/api/projects/${ids.projectId}/structures/${ids.structureId}/models`)
        .send({
          name: 'Report test chain',
          massMatrixKg: [[20_000, 0], [0, 20_000]],
          stiffnessMatrixNPerM: [[16.5e6, -8.25e6], [-8.25e6, 8.25e6]],
          dofLabels: ['quarter point', 'midspan'],
        })
        .expect(201)
    ).body as { id: string };
    const chainMode = (
      await agent
        .post(`/api/projects/${ids.projectId}/structures/${ids.structureId}/modes`)
        .send({ label: 'Report test chain mode', direction: 'vertical', dampingRatio: 0.006, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 1 } })
        .expect(201)
    ).body as { id: string };
    const created = await agent.post(`/api/projects/${ids.projectId}/variants`).send({
      name: 'Report test chain variant', modeId: chainMode.id, loadCaseIds: walkerOnly, criteriaId: ids.criteriaId, massRatio, tuning: { method: 'h2' },
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const chainText = (await pdfText((await agents.fabricator.get(reportPath(ids, created.body.id as string)).buffer(true).parse(asBuffer).expect(200)).body as Buffer)).text;
    expect(chainText).toContain('derived from the lumped model "Report test chain" (2 degrees of freedom)');
    expect(chainText).toContain('undamped mode 1 (ascending frequency)');
    expect(chainText).toContain('DOF 1 (midspan)');
    expect(chainText).toContain('numerical H2 optimum');
  });

  it('another organisation, an unknown variant or a variant of another project is 404; a malformed id is 400; no session is 401', async () => {
    const outsider = await outsiderAgent.get(reportPath(ids, variant.id));
    expect(outsider.status).toBe(404);
    expect(apiErrorSchema.parse(outsider.body).error.code).toBe('project_not_found');

    const unknown = await agents.engineer.get(reportPath(ids, '00000000-0000-4000-8000-000000000000'));
    expect(unknown.status).toBe(404);
    expect(apiErrorSchema.parse(unknown.body).error.code).toBe('variant_not_found');

    const other = await newProject('Report test other footbridge');
    const otherVariant = await newVariant(other);
    expect((await agents.engineer.get(reportPath(ids, otherVariant.id))).status).toBe(404);
    // The outsider's own project does not open ours either.
    expect((await outsiderAgent.get(`/api/projects/${t.outsiderProjectId}/variants/${variant.id}/report.pdf`)).status).toBe(404);

    const malformed = await agents.engineer.get(reportPath(ids, 'not-a-uuid'));
    expect(malformed.status).toBe(400);
    expect(apiErrorSchema.parse(malformed.body).error.issues.map((i) => i.path)).toEqual(['variantId']);

    expect((await request(t.app).get(reportPath(ids, variant.id))).status).toBe(401);
  });

  it('is 409 saying why while the engine refuses the variant\'s inputs', async () => {
    const refused = await newProject('Report test refused footbridge');
    const refusedVariant = await newVariant(refused);
    // A crowd below 1 person/m² needs the structure's own damping: n' = 10.8 √(ζ n) (Sétra 2006), so a mode without
    // damping makes the engine refuse the variant's inputs on its next read.
    await agents.engineer
      .patch(`/api/projects/${refused.projectId}/structures/${refused.structureId}/modes/${refused.modeId}`)
      .send({ version: refused.modeVersion, dampingRatio: 0 })
      .expect(200);
    const read = variantSchema.parse((await agents.engineer.get(`/api/projects/${refused.projectId}/variants/${refusedVariant.id}`).expect(200)).body);
    expect(read.result).toBeNull();
    expect(read.resultError).not.toBeNull();

    const response = await agents.viewer.get(reportPath(refused, refusedVariant.id));
    expect(response.status).toBe(409);
    const error = apiErrorSchema.parse(response.body).error;
    expect(error.code).toBe('variant_without_result');
    expect(error.message).toContain('engine refuses');
    expect(error.issues.map((i) => i.path)).toEqual(['variantId']);
  });
});
