/**
 * Sign-off mails against a real PostgreSQL when the mail relay hangs (accepts the connection and never answers): the
 * submission's and the decision's answers come without waiting for the relay, with their mails `pending`; each
 * background attempt ends at the outbox's own time limit and is counted; a drain stops at the first time-out instead
 * of waiting once per mail; the decision is kept; when the relay is back the mails go out. The time limits of this test are shortened; the product's are in server/mail/outbox.ts. The
 * footbridge numbers are invented test inputs.
 */
import { createServer, type Server, type Socket } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signOffSchema, type SignOff } from '../../shared/contracts/sign-offs';
import { drainOutbox, startOutboxRelay } from '../../server/mail/outbox';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { appUrl, createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';
// Test inputs (invented): the design of the fixture.
import { createTestVariant, newTestDesignProject } from '../support/design-fixture';

const sendTimeoutMs = 4_000;

/** A relay that accepts connections and never says a word (no SMTP greeting). */
async function hangingRelay(): Promise<{ port: number; connections: () => number; close: () => Promise<void> }> {
  const sockets = new Set<Socket>();
  let count = 0;
  const server: Server = createServer((socket) => {
    count++;
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
    socket.on('error', () => undefined);
  });
  await new Promise<void>((resolvePromise) => server.listen(0, '127.0.0.1', resolvePromise));
  return {
    port: (server.address() as AddressInfo).port,
    connections: () => count,
    close: () =>
      new Promise<void>((resolvePromise) => {
        for (const socket of sockets) socket.destroy();
        server.close(() => resolvePromise());
      }),
  };
}

/** Reads the sign-off until `done` holds for its mails (the sends run in the background). */
async function waitForMails(agent: Agent, url: string, done: (mails: SignOff['mails']) => boolean, timeoutMs = 20_000): Promise<SignOff> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const current = signOffSchema.parse((await agent.get(url).expect(200)).body);
    if (done(current.mails)) return current;
    if (Date.now() > deadline) throw new Error(`mails of ${url} not as awaited: ${JSON.stringify(current.mails)}`);
    await new Promise((wait) => setTimeout(wait, 25));
  }
}

let relay: Awaited<ReturnType<typeof hangingRelay>>;
let t: TestApp;

beforeAll(async () => {
  relay = await hangingRelay();
  t = await createTestApp({ env: { STILLSPAN_FAKE_SMTP: '0', SMTP_HOST: '127.0.0.1', SMTP_PORT: String(relay.port) } });
  // The same relay as the server's, with a short time limit per mail and no periodic drain during the test.
  await t.ctx.outbox.stop();
  t.ctx.outbox = startOutboxRelay(t.ctx.db, t.ctx.mailer, { periodMs: 3_600_000, sendTimeoutMs });
});

afterAll(async () => {
  await t?.close();
  await relay?.close();
});

describe('sign-off mails while the relay hangs', () => {
  it('answers the submission and the decision at once, keeps the decision, and sends the mails when the relay is back', async () => {
    const engineer = await signIn(t.app, t.people.engineer.email);
    const owner = await signIn(t.app, t.people.owner.email);
    const ids = await newTestDesignProject(engineer, 'Hanging relay footbridge');
    const { projectId } = ids;
    const variantId = (await createTestVariant(engineer, ids, { name: 'Hanging relay variant', loadCaseIds: [ids.crowdId] })).id;

    // The answer lists the mail as pending with no attempt ended: it did not wait for the hanging relay.
    const response = await engineer.post(`/api/projects/${projectId}/sign-offs`).send({ variantId });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const submitted = signOffSchema.parse(response.body);
    expect(submitted.mails).toEqual([{ to: t.people.owner.email, state: 'pending', attempts: 0 }]);
    const url = `/api/projects/${projectId}/sign-offs/${submitted.id}`;

    // In the background the attempt reaches the relay, ends at the time limit and is counted; the mail waits.
    const afterSubmitAttempt = await waitForMails(engineer, url, (mails) => mails.every((m) => m.attempts > 0));
    expect(afterSubmitAttempt.mails).toEqual([{ to: t.people.owner.email, state: 'pending', attempts: 1 }]);
    expect(relay.connections()).toBeGreaterThanOrEqual(1);
    const { rows } = await t.ctx.pool.query<{ last_error: string }>(`select last_error from outbox where sign_off_id = $1`, [submitted.id]);
    expect(rows[0].last_error).toContain(`did not accept the mail within ${sendTimeoutMs / 1000} s`);

    // The owner's decision is answered at once too and is kept, whatever the relay does.
    const decided = await owner.post(`${url}/approve`).send({ comment: 'Approved while the relay hangs (test).' });
    expect(decided.status, JSON.stringify(decided.body)).toBe(200);
    const approved = signOffSchema.parse(decided.body);
    expect(approved.status).toBe('approved');
    expect(approved.mails).toEqual([
      { to: t.people.owner.email, state: 'pending', attempts: 1 },
      { to: t.people.engineer.email, state: 'pending', attempts: 0 },
    ]);
    const afterDecisionAttempt = await waitForMails(engineer, url, (mails) => mails.every((m) => m.attempts > 0));
    expect(afterDecisionAttempt.status).toBe('approved');
    expect(afterDecisionAttempt.mails.map((m) => m.state)).toEqual(['pending', 'pending']);

    // A drain of both while the relay still hangs tries the first, and after its time-out leaves the second for the
    // next round without counting an attempt: one time limit, not one per mail.
    await t.ctx.outbox.idle();
    const started = Date.now();
    expect(await drainOutbox(t.ctx.db, t.ctx.mailer, { dueOrNot: true, sendTimeoutMs })).toBe(0);
    expect(Date.now() - started).toBeLessThan(2 * sendTimeoutMs);
    const afterHungDrain = signOffSchema.parse((await engineer.get(url).expect(200)).body);
    expect(afterHungDrain.mails).toEqual([
      { to: t.people.owner.email, state: 'pending', attempts: 2 },
      { to: t.people.engineer.email, state: 'pending', attempts: 1 },
    ]);

    // The relay is back on the same port: the next drain (here without waiting for the backoff) sends both.
    await relay.close();
    const back = await startFakeSmtp({ host: '127.0.0.1', port: relay.port });
    try {
      expect(await drainOutbox(t.ctx.db, t.ctx.mailer, { dueOrNot: true })).toBe(2);
      const sent = await waitForMails(engineer, url, (mails) => mails.every((m) => m.state === 'sent'));
      expect(sent.mails).toEqual([
        { to: t.people.owner.email, state: 'sent', attempts: 3 },
        { to: t.people.engineer.email, state: 'sent', attempts: 2 },
      ]);
      const decisionMail = back.mails().find((m) => m.to.includes(t.people.engineer.email));
      expect(decisionMail?.text).toContain('Approved while the relay hangs (test).');
      expect(decisionMail?.text).toContain(`${appUrl}/projects/${projectId}/sign-off`);
    } finally {
      await back.close();
    }
  });
});
