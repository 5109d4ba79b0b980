/**
 * Password guessing and sign-in floods: counts kept atomically in PostgreSQL (30 simultaneous guesses, at most 10
 * checked), per e-mail address and client address and per client address, so that a guesser is slowed down without
 * shutting the rightful owner out from elsewhere; and a flood of anonymous sign-ins with new addresses leaves
 * signed-in people fast (the password hashes run off the event loop).
 */
import { createServer, type Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createTestApp, signIn, testPassword, type TestApp } from '../support/test-app';

let t: TestApp;
let server: Server;

beforeAll(async () => {
  t = await createTestApp();
  server = createServer(t.app);
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
});

afterAll(async () => {
  await new Promise((done) => server?.close(done));
  await t?.close();
});

/** An agent holding a CSRF cookie and token, posting sign-ins as the client `address` (X-Forwarded-For from loopback). */
async function signInClient(target: Server | ReturnType<typeof createApp>, address: string) {
  const agent = request.agent(target);
  const { csrfToken } = (await agent.get('/api/auth/csrf').expect(200)).body as { csrfToken: string };
  return (email: string, password: string) =>
    agent.post('/api/auth/callback/credentials').set('X-Forwarded-For', address).type('form').send({ csrfToken, email, password });
}

describe('simultaneous guesses', () => {
  it('30 wrong passwords at once for one address: at most 10 are checked, the rest get 429', async () => {
    const post = await signInClient(server, '198.51.100.10');
    const responses = await Promise.all(Array.from({ length: 30 }, (_, i) => post(t.people.viewer.email, `wrong-${i}`)));
    const checked = responses.filter((r) => r.status === 302 && String(r.headers.location).includes('error=CredentialsSignin'));
    const refused = responses.filter((r) => r.status === 429);
    expect(checked.length).toBeLessThanOrEqual(10);
    expect(checked.length + refused.length).toBe(30);
    expect(refused[0].body.error.code).toBe('too_many_sign_in_attempts');
    // The right password from the same client is refused too, until the window passes…
    const right = await post(t.people.viewer.email, testPassword);
    expect(right.status).toBe(429);
    expect(right.body.error.message).toMatch(/^Too many sign-in attempts from here; try again in 15 minutes\./);
    expect(Number(right.headers['retry-after'])).toBeGreaterThan(14 * 60);
    // …but the rightful owner signing in from another client address is not shut out.
    const elsewhere = await signInClient(server, '192.0.2.44');
    const owner = await elsewhere(t.people.viewer.email, testPassword);
    expect(owner.status).toBe(302);
    expect(owner.headers.location).not.toContain('error=');
  });
});

describe('limits per client address', () => {
  it('many addresses from one client are refused after the per-client limit; other clients go on', async () => {
    const app = createApp(t.ctx, { clientDir: null, signInThrottle: { maxPerClient: 12, maxPerAddressAndClient: 10, windowS: 60 } });
    const flooder = await signInClient(app, '198.51.100.77');
    const statuses: number[] = [];
    const emails = Object.values(t.people).map((person) => person.email);
    for (let i = 0; i < 15; i += 1) statuses.push((await flooder(emails[i % emails.length], 'guess')).status);
    expect(statuses.slice(0, 12).every((s) => s === 302)).toBe(true);
    expect(statuses.slice(12)).toEqual([429, 429, 429]);
    const other = await signInClient(app, '198.51.100.78');
    expect((await other(emails[0], 'guess')).status).toBe(302);
  });

  it('once the window has passed, the client may try again', async () => {
    const app = createApp(t.ctx, { clientDir: null, signInThrottle: { maxPerAddressAndClient: 2, windowS: 1 } });
    const client = await signInClient(app, '198.51.100.80');
    const statuses = [];
    for (let i = 0; i < 3; i += 1) statuses.push((await client(t.people.admin.email, 'wrong')).status);
    expect(statuses).toEqual([302, 302, 429]);
    await new Promise((wait) => setTimeout(wait, 1100));
    expect((await client(t.people.admin.email, testPassword)).headers.location).not.toContain('error=');
  });

  it('a successful sign-in clears the count for its address and client', async () => {
    const app = createApp(t.ctx, { clientDir: null, signInThrottle: { maxPerAddressAndClient: 3, windowS: 60 } });
    const client = await signInClient(app, '198.51.100.90');
    for (let i = 0; i < 2; i += 1) expect((await client(t.people.engineer.email, 'wrong')).status).toBe(302);
    const ok = await client(t.people.engineer.email, testPassword);
    expect(ok.headers.location).not.toContain('error=');
    for (let i = 0; i < 2; i += 1) expect((await client(t.people.engineer.email, 'wrong')).headers.location).toContain('error=CredentialsSignin');
    expect((await client(t.people.engineer.email, testPassword)).headers.location).not.toContain('error=');
  });

  it('the count is shared by every server process: two apps on one database count together', async () => {
    const first = createApp(t.ctx, { clientDir: null, signInThrottle: { maxPerAddressAndClient: 4, windowS: 60 } });
    const second = createApp(t.ctx, { clientDir: null, signInThrottle: { maxPerAddressAndClient: 4, windowS: 60 } });
    const a = await signInClient(first, '198.51.100.120');
    const b = await signInClient(second, '198.51.100.120');
    const statuses = [];
    for (let i = 0; i < 3; i += 1) statuses.push((await a(t.people.owner.email, 'wrong')).status, (await b(t.people.owner.email, 'wrong')).status);
    expect(statuses.filter((s) => s === 302)).toHaveLength(4);
    expect(statuses.filter((s) => s === 429)).toHaveLength(2);
  });
});

describe('a flood of anonymous sign-ins', () => {
  it('keeps the median signed-in read under 0.15 s while attempts with new addresses arrive as fast as they are answered', async () => {
    const reader = await signIn(server as unknown as Parameters<typeof signIn>[0], t.people.engineer.email);
    let stop = false;
    let attempts = 0;
    const flooders = Array.from({ length: 8 }, async (_, f) => {
      for (let i = 0; !stop; i += 1) {
        // A new client address every few attempts, so that the per-client limit does not answer for the hashing.
        const post = await signInClient(server, `203.0.113.${(f * 31 + i) % 250}`);
        for (let j = 0; j < 5 && !stop; j += 1) {
          await post(`flood-${f}-${i}-${j}@nowhere.test`, 'a-guessed-password');
          attempts += 1;
        }
      }
    });
    await new Promise((wait) => setTimeout(wait, 500));
    // Signed-in reads one after the other for four seconds of flood.
    const timesMs: number[] = [];
    const attemptsBefore = attempts;
    const until = performance.now() + 4000;
    while (performance.now() < until || timesMs.length < 10) {
      const started = performance.now();
      await reader.get('/api/projects').expect(200);
      timesMs.push(performance.now() - started);
    }
    const attemptsDuring = attempts - attemptsBefore;
    stop = true;
    await Promise.all(flooders);
    timesMs.sort((x, y) => x - y);
    const medianMs = timesMs[Math.floor(timesMs.length / 2)];
    // Each attempt with an unknown address costs a full scrypt hash (the decoy): a few per second on two free cores,
    // fewer on a busy machine. The flood must have gone on during the reads.
    process.stdout.write(`[flood] ${attemptsDuring} sign-in attempts during ${timesMs.length} reads; median read ${medianMs.toFixed(1)} ms\n`);
    expect(attemptsDuring).toBeGreaterThanOrEqual(3);
    expect(medianMs, `median of ${timesMs.length} reads during ${attemptsDuring} sign-in attempts`).toBeLessThan(150);
  });
});
