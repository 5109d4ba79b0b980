/**
 * Sign-off against a real PostgreSQL: the state machine and who may move it, the comfort criteria's status following
 * it, an approved design frozen by the services and by the database's triggers, a returned design changed and
 * submitted again, the mails through the fake SMTP server, and the outbox keeping mails while the relay is down.
 * The footbridge numbers below are invented test inputs, not the values of any structure.
 */
import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/contracts/errors';
import { signOffListSchema, signOffSchema, type SignOff } from '../../shared/contracts/sign-offs';
import { variantSchema, type Variant } from '../../shared/contracts/variants';
import { createTestVariant, newTestDesignProject, testCriteriaSpec, type TestDesignIds } from '../support/design-fixture';
import { comfortCriteriaSchema } from '../../shared/contracts/model';
import { roles, type Role } from '../../shared/contracts/roles';
import { drainOutbox } from '../../server/mail/outbox';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { appUrl, createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents = {} as Record<Role, Agent>;
let outsiderAgent: Agent;

const errorOf = (body: unknown) => apiErrorSchema.parse(body).error;

// Test inputs (invented): the design of tests/support/design-fixture.ts.
const criteriaSpec = testCriteriaSpec;
type Ids = TestDesignIds;
const newProject = (name: string): Promise<Ids> => newTestDesignProject(agents.engineer, name);
const createVariant = (ids: Ids, over: Record<string, unknown> = {}): Promise<Variant> => createTestVariant(agents.engineer, ids, over);

const signOffsOf = (ids: Ids) => `/api/projects/${ids.projectId}/sign-offs`;
const modeUrl = (ids: Ids) => `/api/projects/${ids.projectId}/structures/${ids.structureId}/modes/${ids.modeId}`;

/**
 * The sign-off read again (by `agent`) until each of its mails has had its first attempt: the send after commit runs
 * in the background, so an answer may still list a mail as `pending` with no attempt.
 */
async function afterFirstAttempts(url: string, agent: Agent = agents.viewer, timeoutMs = 20_000): Promise<SignOff> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const current = signOffSchema.parse((await agent.get(url).expect(200)).body);
    if (current.mails.every((m) => m.attempts > 0)) return current;
    if (Date.now() > deadline) throw new Error(`the mails of ${url} are still waiting for their first attempt: ${JSON.stringify(current.mails)}`);
    await new Promise((wait) => setTimeout(wait, 25));
  }
}

/** Submits and waits until the submission's mails have been tried, so that a later test's mailbox holds only its own. */
async function submit(ids: Ids, variantId: string, agent = agents.engineer, message?: string): Promise<SignOff> {
  const response = await agent.post(signOffsOf(ids)).send({ variantId, ...(message ? { message } : {}) });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  const answered = signOffSchema.parse(response.body);
  const tried = await afterFirstAttempts(`${signOffsOf(ids)}/${answered.id}`);
  return { ...answered, mails: tried.mails };
}

async function criteriaStatus(ids: Ids): Promise<string> {
  return comfortCriteriaSchema.parse((await agents.viewer.get(`/api/projects/${ids.projectId}/comfort-criteria/${ids.criteriaId}`).expect(200)).body).status;
}

beforeAll(async () => {
  t = await createTestApp();
  for (const role of roles) agents[role] = await signIn(t.app, t.people[role].email);
  outsiderAgent = await signIn(t.app, t.outsider.email);
});

afterAll(async () => {
  await t?.close();
});

describe('submitting a design', () => {
  it('copies the variant, its mode, load cases, criteria and result; only admins and engineers submit', async () => {
    const ids = await newProject('Sign-off submit footbridge');
    const variant = await createVariant(ids);
    for (const role of ['owner', 'fabricator', 'viewer'] as const) {
      const response = await agents[role].post(signOffsOf(ids)).send({ variantId: variant.id });
      expect(response.status, role).toBe(403);
    }
    t.ctx.fakeSmtp?.clear();
    const signOff = await submit(ids, variant.id, agents.admin, 'Please check the crowd case first.');
    expect(signOff.status).toBe('submitted');
    expect(signOff.variantId).toBe(variant.id);
    expect(signOff.criteriaId).toBe(ids.criteriaId);
    expect(signOff.submittedBy).toBe(t.people.admin.id);
    expect(signOff.decidedAt).toBeNull();
    expect(signOff.snapshot.variant.result?.inputsHash).toBe(variant.result?.inputsHash);
    expect(signOff.snapshot.variant.result?.loadCases).toEqual(variant.result?.loadCases);
    expect(signOff.snapshot.engineVersion).toBe(variant.result?.engineVersion);
    expect(signOff.snapshot.mode.id).toBe(ids.modeId);
    expect(signOff.snapshot.mode.frequencyHz).toBe(2.0);
    expect(signOff.snapshot.loadCases.map((l) => l.id)).toEqual([ids.crowdId, ids.walkerId]);
    expect(signOff.snapshot.criteria.spec).toMatchObject(criteriaSpec);
    expect(await criteriaStatus(ids)).toBe('submitted');

    // The one owner of organisation A gets the mail, with the link to the project's sign-off page.
    expect(signOff.mails).toEqual([{ to: t.people.owner.email, state: 'sent', attempts: 1 }]);
    const mails = t.ctx.fakeSmtp?.mails() ?? [];
    expect(mails).toHaveLength(1);
    expect(mails[0].to).toEqual([t.people.owner.email]);
    expect(mails[0].subject).toContain('Sign-off requested');
    expect(mails[0].subject).toContain(variant.name);
    expect(mails[0].text).toContain(`${appUrl}/projects/${ids.projectId}/sign-off`);
    expect(mails[0].text).toContain('Please check the crowd case first.');
    expect(mails[0].text).toContain('never replace, the judgement of a qualified engineer');

    const again = await agents.engineer.post(signOffsOf(ids)).send({ variantId: variant.id });
    expect(again.status).toBe(409);
    expect(errorOf(again.body).code).toBe('sign_off_pending');
  });

  it('refuses a variant of another project naming variantId, and a variant without a result with 409 saying why', async () => {
    const a = await newProject('Sign-off project A');
    const b = await newProject('Sign-off project B');
    const variantOfB = await createVariant(b);
    const response = await agents.engineer.post(signOffsOf(a)).send({ variantId: variantOfB.id });
    expect(response.status).toBe(400);
    expect(errorOf(response.body).issues.map((i) => i.path)).toEqual(['variantId']);

    const unknownField = await agents.engineer.post(signOffsOf(a)).send({ variantId: variantOfB.id, status: 'approved' });
    expect(unknownField.status).toBe(400);

    // A refusal the engine stored on a read (result null, resultError naming the field, inputs hash current) is
    // written here directly: the variants service serves it as it is until the inputs change.
    const crowdOnly = await createVariant(a, { loadCaseIds: [a.crowdId] });
    const resultError = { code: 'invalid_inputs', message: 'loadCaseIds.0: the engine refuses this load case for this mode', issues: [] };
    await t.ctx.pool.query(`update tuning_variants set result = null, result_error = $2 where id = $1`, [crowdOnly.id, JSON.stringify(resultError)]);
    const read = variantSchema.parse((await agents.engineer.get(`/api/projects/${a.projectId}/variants/${crowdOnly.id}`).expect(200)).body);
    expect(read.result).toBeNull();
    const refused = await agents.engineer.post(signOffsOf(a)).send({ variantId: crowdOnly.id });
    expect(refused.status).toBe(409);
    expect(errorOf(refused.body).code).toBe('variant_without_result');
    expect(errorOf(refused.body).message).toContain('engine refuses');
  });
});

describe('deciding', () => {
  let ids: Ids;
  let variant: Variant;
  let signOff: SignOff;

  beforeAll(async () => {
    ids = await newProject('Sign-off decision footbridge');
    variant = await createVariant(ids);
    signOff = await submit(ids, variant.id);
  });

  it('only the owner decides: admin, engineer (the submitter), fabricator and viewer get 403', async () => {
    for (const role of ['admin', 'engineer', 'fabricator', 'viewer'] as const) {
      expect((await agents[role].post(`${signOffsOf(ids)}/${signOff.id}/approve`).send({})).status, role).toBe(403);
      expect((await agents[role].post(`${signOffsOf(ids)}/${signOff.id}/return`).send({ comment: 'No.' })).status, role).toBe(403);
    }
    const still = signOffSchema.parse((await agents.viewer.get(`${signOffsOf(ids)}/${signOff.id}`).expect(200)).body);
    expect(still.status).toBe('submitted');
  });

  it('a return needs a comment (400 naming comment)', async () => {
    for (const body of [{}, { comment: '   ' }]) {
      const response = await agents.owner.post(`${signOffsOf(ids)}/${signOff.id}/return`).send(body);
      expect(response.status).toBe(400);
      expect(errorOf(response.body).issues.map((i) => i.path)).toEqual(['comment']);
    }
  });

  it('the owner approves once; the criteria become approved and the submitter gets the mail with the comment', async () => {
    t.ctx.fakeSmtp?.clear();
    const response = await agents.owner.post(`${signOffsOf(ids)}/${signOff.id}/approve`).send({ comment: 'Agreed for the crowd class.' });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const approved = signOffSchema.parse(response.body);
    expect(approved.status).toBe('approved');
    expect(approved.decidedBy).toBe(t.people.owner.id);
    expect(approved.decisionComment).toBe('Agreed for the crowd class.');
    // The decider as they were at the decision, kept with it.
    expect(approved.decidedByName).toBe('A owner');
    expect(approved.decidedByEmail).toBe(t.people.owner.email);
    // The sign-off's mails: the submission's to the owner, then the decision's to the submitter (sent in the
    // background after the answer).
    expect((await afterFirstAttempts(`${signOffsOf(ids)}/${signOff.id}`)).mails).toEqual([
      { to: t.people.owner.email, state: 'sent', attempts: 1 },
      { to: t.people.engineer.email, state: 'sent', attempts: 1 },
    ]);
    expect(await criteriaStatus(ids)).toBe('approved');
    const mails = t.ctx.fakeSmtp?.mails() ?? [];
    expect(mails).toHaveLength(1);
    expect(mails[0].to).toEqual([t.people.engineer.email]);
    expect(mails[0].subject).toContain('approved');
    expect(mails[0].text).toContain('Agreed for the crowd class.');
    expect(mails[0].text).toContain(`${appUrl}/projects/${ids.projectId}/sign-off`);

    for (const path of ['approve', 'return']) {
      const twice = await agents.owner.post(`${signOffsOf(ids)}/${signOff.id}/${path}`).send({ comment: 'Again.' });
      expect(twice.status, path).toBe(409);
      expect(errorOf(twice.body).code).toBe('sign_off_decided');
    }
  });

  it('everyone in the organisation reads the sign-offs, newest first; another organisation gets 404', async () => {
    const second = await createVariant(ids, { name: 'Test Den Hartog 3 %', massRatio: 0.03 });
    const newer = await submit(ids, second.id);
    for (const role of roles) {
      const list = signOffListSchema.parse((await agents[role].get(signOffsOf(ids)).expect(200)).body);
      expect(list.signOffs.map((s) => s.id), role).toEqual([newer.id, signOff.id]);
    }
    expect((await outsiderAgent.get(signOffsOf(ids))).status).toBe(404);
    expect((await outsiderAgent.get(`${signOffsOf(ids)}/${signOff.id}`)).status).toBe(404);
    expect((await outsiderAgent.post(`${signOffsOf(ids)}/${signOff.id}/approve`).send({})).status).toBe(403);
  });

  it('freezes the approved variant, its mode, load cases and criteria (409, nothing changed)', async () => {
    const base = `/api/projects/${ids.projectId}`;
    const before = variantSchema.parse((await agents.viewer.get(`${base}/variants/${variant.id}`).expect(200)).body);
    const attempts: [string, () => Promise<{ status: number; body: unknown }>][] = [
      ['PATCH variant', () => agents.engineer.patch(`${base}/variants/${variant.id}`).send({ version: before.version, massRatio: 0.05 })],
      ['DELETE variant', () => agents.engineer.delete(`${base}/variants/${variant.id}`)],
      ['PATCH mode', () => agents.engineer.patch(modeUrl(ids)).send({ version: 1, frequencyHz: 2.2 })],
      ['DELETE mode', () => agents.engineer.delete(modeUrl(ids))],
      ['PATCH load case', () => agents.engineer.patch(`${base}/load-cases/${ids.crowdId}`).send({ version: 1, name: 'Changed' })],
      ['DELETE load case', () => agents.engineer.delete(`${base}/load-cases/${ids.crowdId}`)],
      ['PATCH criteria', () => agents.engineer.patch(`${base}/comfort-criteria/${ids.criteriaId}`).send({ version: 3, name: 'Changed' })],
      ['DELETE criteria', () => agents.engineer.delete(`${base}/comfort-criteria/${ids.criteriaId}`)],
    ];
    for (const [what, attempt] of attempts) {
      const response = await attempt();
      expect(response.status, what).toBe(409);
      expect(errorOf(response.body).code, what).toBe('approved_design_frozen');
      expect(errorOf(response.body).message, what).toContain('copy the variant and submit again');
    }
    // A project holding an approved design keeps it.
    const projectDelete = await agents.engineer.delete(base);
    expect(projectDelete.status).toBe(409);
    expect(errorOf(projectDelete.body).code).toBe('approved_design_frozen');
    const after = variantSchema.parse((await agents.viewer.get(`${base}/variants/${variant.id}`).expect(200)).body);
    expect(after).toEqual(before);
    const modeAfter = (await agents.viewer.get(modeUrl(ids)).expect(200)).body as { frequencyHz: number; version: number };
    expect(modeAfter).toMatchObject({ frequencyHz: 2.0, version: 1 });
    const crowd = (await agents.viewer.get(`${base}/load-cases/${ids.crowdId}`).expect(200)).body as { name: string };
    expect(crowd.name).toBe('Test crowd');
    // Criteria an approved sign-off rests on stay approved while another design using them waits for a decision.
    expect(await criteriaStatus(ids)).toBe('approved');
  });

  it('the database itself refuses a raw change of the approved variant, its mode, load case and criteria', async () => {
    const statements: [string, string][] = [
      ['variant', `update tuning_variants set mass_ratio = 0.05 where id = '${variant.id}'`],
      ['variant delete', `delete from tuning_variants where id = '${variant.id}'`],
      ['load-case link', `delete from tuning_variant_load_cases where variant_id = '${variant.id}'`],
      ['mode', `update structure_modes set frequency_hz = 2.2 where id = '${ids.modeId}'`],
      ['load case', `update load_cases set name = 'Changed' where id = '${ids.crowdId}'`],
      ['criteria', `update comfort_criteria set name = 'Changed' where id = '${ids.criteriaId}'`],
      ['criteria status without the sign-off setting', `update comfort_criteria set status = 'draft' where id = '${ids.criteriaId}'`],
    ];
    for (const [what, statement] of statements) {
      await expect(t.ctx.pool.query(statement), what).rejects.toMatchObject({ code: 'SO409' });
    }
    const { rows } = await t.ctx.pool.query<{ mass_ratio: number }>(`select mass_ratio from tuning_variants where id = $1`, [variant.id]);
    expect(rows[0].mass_ratio).toBe(0.02);
  });
});

describe('an approved mode taken from a lumped model', () => {
  it('refuses a change of the model that would re-derive the mode (409, model and mode unchanged)', async () => {
    const ids = await newProject('Sign-off lumped-model footbridge');
    const base = `/api/projects/${ids.projectId}/structures/${ids.structureId}`;
    // One DOF of 30 t on a spring of m (2π · 2 Hz)²: a 2 Hz mode (invented test values).
    const stiffness = 30_000 * (2 * Math.PI * 2) ** 2;
    const model = (await agents.engineer.post(`${base}/models`).send({ name: 'Test one-DOF model', massMatrixKg: [[30_000]], stiffnessMatrixNPerM: [[stiffness]] }).expect(201)).body as {
      id: string;
      version: number;
    };
    const derived = await agents.engineer
      .post(`${base}/modes`)
      .send({ label: 'Test derived mode', dampingRatio: 0.005, modeShapeMean: 0.6, source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: 0 } });
    expect(derived.status, JSON.stringify(derived.body)).toBe(201);
    const modeId = (derived.body as { id: string; frequencyHz: number }).id;
    const variant = await createVariant({ ...ids, modeId });
    const signOff = await submit(ids, variant.id);
    await agents.owner.post(`${signOffsOf(ids)}/${signOff.id}/approve`).send({}).expect(200);
    await afterFirstAttempts(`${signOffsOf(ids)}/${signOff.id}`);
    const response = await agents.engineer.patch(`${base}/models/${model.id}`).send({ version: model.version, stiffnessMatrixNPerM: [[stiffness * 1.1]] });
    expect(response.status).toBe(409);
    expect(errorOf(response.body).code).toBe('approved_design_frozen');
    const after = (await agents.viewer.get(`${base}/models/${model.id}`).expect(200)).body as { version: number; stiffnessMatrixNPerM: number[][] };
    expect(after.version).toBe(model.version);
    expect(after.stiffnessMatrixNPerM).toEqual([[stiffness]]);
  });

  it('another organisation cannot submit in this organisation\'s project (404)', async () => {
    const ids = await newProject('Sign-off outsider footbridge');
    const variant = await createVariant(ids);
    expect((await outsiderAgent.post(signOffsOf(ids)).send({ variantId: variant.id })).status).toBe(404);
  });
});

describe('a returned design', () => {
  it('can be changed and submitted again; the submitter gets the comment', async () => {
    const ids = await newProject('Sign-off returned footbridge');
    const variant = await createVariant(ids);
    const first = await submit(ids, variant.id);
    t.ctx.fakeSmtp?.clear();
    const response = await agents.owner.post(`${signOffsOf(ids)}/${first.id}/return`).send({ comment: 'Check the walker at 3 % mass ratio.' });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const returned = signOffSchema.parse(response.body);
    expect(returned.status).toBe('returned');
    expect(returned.decisionComment).toBe('Check the walker at 3 % mass ratio.');
    expect(await criteriaStatus(ids)).toBe('returned');
    await afterFirstAttempts(`${signOffsOf(ids)}/${first.id}`);
    const mails = t.ctx.fakeSmtp?.mails() ?? [];
    expect(mails).toHaveLength(1);
    expect(mails[0].to).toEqual([t.people.engineer.email]);
    expect(mails[0].subject).toContain('returned');
    expect(mails[0].text).toContain('Check the walker at 3 % mass ratio.');
    expect(mails[0].text).toContain(`${appUrl}/projects/${ids.projectId}/sign-off`);

    const changed = await agents.engineer.patch(`/api/projects/${ids.projectId}/variants/${variant.id}`).send({ version: variant.version, massRatio: 0.03 });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    const second = await submit(ids, variant.id);
    expect(second.snapshot.variant.massRatio).toBe(0.03);
    expect(await criteriaStatus(ids)).toBe('submitted');
  });

  it('an approval is refused when the design changed after it was submitted', async () => {
    const ids = await newProject('Sign-off changed footbridge');
    const variant = await createVariant(ids);
    const signOff = await submit(ids, variant.id);
    await agents.engineer.patch(`/api/projects/${ids.projectId}/variants/${variant.id}`).send({ version: variant.version, massRatio: 0.03 }).expect(200);
    const response = await agents.owner.post(`${signOffsOf(ids)}/${signOff.id}/approve`).send({});
    expect(response.status).toBe(409);
    expect(errorOf(response.body).code).toBe('design_changed_since_submission');
    const still = signOffSchema.parse((await agents.viewer.get(`${signOffsOf(ids)}/${signOff.id}`).expect(200)).body);
    expect(still.status).toBe('submitted');
  });
});

/** A port nothing listens on (taken from the system, then released). */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolvePromise) => server.listen(0, '127.0.0.1', resolvePromise));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((resolvePromise) => server.close(() => resolvePromise()));
  return port;
}

describe('the mail outbox', () => {
  it('keeps the decision and the mail while the relay is down, and sends it when the relay is back', async () => {
    const port = await closedPort();
    const down = await createTestApp({ env: { STILLSPAN_FAKE_SMTP: '0', SMTP_HOST: '127.0.0.1', SMTP_PORT: String(port) } });
    try {
      const engineer = await signIn(down.app, down.people.engineer.email);
      const ids = await newTestDesignProject(engineer, 'Outbox footbridge');
      const { projectId } = ids;
      const variantId = (await createTestVariant(engineer, ids, { name: 'Outbox variant', loadCaseIds: [ids.crowdId] })).id;
      const response = await engineer.post(`/api/projects/${projectId}/sign-offs`).send({ variantId });
      expect(response.status, JSON.stringify(response.body)).toBe(201);
      const submitted = signOffSchema.parse(response.body);
      expect(submitted.status).toBe('submitted');
      const tried = await afterFirstAttempts(`/api/projects/${projectId}/sign-offs/${submitted.id}`, engineer);
      expect(tried.mails).toEqual([{ to: down.people.owner.email, state: 'pending', attempts: 1 }]);

      // The relay comes back on the same port; the next drain (here without waiting for the backoff) sends it.
      const relay = await startFakeSmtp({ host: '127.0.0.1', port });
      try {
        expect(await drainOutbox(down.ctx.db, down.ctx.mailer, { dueOrNot: true })).toBe(1);
        const after = signOffSchema.parse((await engineer.get(`/api/projects/${projectId}/sign-offs/${submitted.id}`).expect(200)).body);
        expect(after.mails).toEqual([{ to: down.people.owner.email, state: 'sent', attempts: 2 }]);
        expect(relay.mails().map((m) => m.to)).toEqual([[down.people.owner.email]]);
        expect(relay.mails()[0].text).toContain(`${appUrl}/projects/${projectId}/sign-off`);
      } finally {
        await relay.close();
      }
    } finally {
      await down.close();
    }
  });
});
