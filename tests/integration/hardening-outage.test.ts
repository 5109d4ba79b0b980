/**
 * A database outage: signed-in routes answer 503 database_unavailable quickly (no 500, no stack trace per request,
 * one log line per outage), sign-in answers 503 instead of a configuration error, compute that needs no stored data
 * keeps working for a valid session, and everything recovers without a restart. The test stops and restarts a
 * cluster of its own.
 */
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/auth/password';
import type { AppContext } from '../../server/context';
import { memberships, organisations, users } from '../../server/db/schema';
import { closeContext, createContext } from '../../server/server';
import { startThrowawayCluster } from '../support/pg-cluster';
import { attemptSignIn, signIn, testEnv, testPassword, type Agent } from '../support/test-app';

let cluster: Awaited<ReturnType<typeof startThrowawayCluster>>;
let ctx: AppContext;
let app: Express;
let engineer: Agent;

beforeAll(async () => {
  cluster = await startThrowawayCluster();
  ctx = await createContext(testEnv(cluster.url, { STILLSPAN_COMPUTE_THREADS: '1' }), { seed: false });
  const [organisation] = await ctx.db.insert(organisations).values({ name: 'Outage organisation' }).returning();
  const [user] = await ctx.db
    .insert(users)
    .values({ email: 'engineer@outage.test', name: 'Outage engineer', passwordHash: await hashPassword(testPassword, 4) })
    .returning();
  await ctx.db.insert(memberships).values({ organisationId: organisation.id, userId: user.id, role: 'engineer' });
  app = createApp(ctx, { clientDir: null });
  engineer = await signIn(app, 'engineer@outage.test');
});

afterAll(async () => {
  if (ctx) await closeContext(ctx);
  await cluster?.stop();
});

async function timed<T>(run: () => PromiseLike<T>): Promise<{ value: T; ms: number }> {
  const started = performance.now();
  const value = await run();
  return { value, ms: performance.now() - started };
}

describe('with the database stopped', () => {
  it('answers 503 database_unavailable within 2 s, logs the outage once, keeps compute working, and recovers', async () => {
    await engineer.get('/api/me').expect(200);
    const written: string[] = [];
    const write = vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => {
      written.push(String(chunk));
      return true;
    });
    try {
      await cluster.pause();
      for (const path of ['/api/me', '/api/projects', '/api/organisation/people', '/api/me', '/api/projects']) {
        const { value, ms } = await timed(() => engineer.get(path));
        expect(value.status, path).toBe(503);
        expect(value.body.error.code, path).toBe('database_unavailable');
        expect(value.headers['retry-after']).toBe('5');
        expect(ms, path).toBeLessThan(2000);
      }
      const health = await timed(() => request(app).get('/api/health'));
      expect(health.value.status).toBe(503);
      expect(health.ms).toBeLessThan(2500);

      // Sign-in says the database is unavailable, not a configuration error.
      const { response: signInResponse } = await attemptSignIn(app, 'engineer@outage.test', testPassword);
      expect(signInResponse.status).toBe(503);
      expect(signInResponse.body.error.code).toBe('database_unavailable');

      // Compute needs no stored data: a valid session still computes (Den Hartog, Mechanical Vibrations (1956): f = 1/(1+μ)).
      const tune = await engineer.post('/api/compute/tune').send({ method: 'den-hartog', massRatio: 0.05, structureFrequencyHz: 2 });
      expect(tune.status).toBe(200);
      expect(tune.body.frequencyRatio).toBeCloseTo(1 / 1.05, 9);
      // …but not without one.
      await request(app).post('/api/compute/tune').send({ method: 'den-hartog', massRatio: 0.05, structureFrequencyHz: 2 }).expect(401);
    } finally {
      write.mockRestore();
    }
    const outageLines = written.filter((line) => line.includes('the database is unreachable'));
    expect(outageLines).toHaveLength(1);
    expect(written.filter((line) => line.startsWith('[api]'))).toEqual([]);

    // Back without a restart of the server.
    await cluster.resume();
    let status = 0;
    for (let i = 0; i < 20 && status !== 200; i += 1) {
      status = (await engineer.get('/api/me')).status;
      if (status !== 200) await new Promise((wait) => setTimeout(wait, 250));
    }
    expect(status).toBe(200);
    await request(app).get('/api/health').expect(200);
    await signIn(app, 'engineer@outage.test');
  });
});
