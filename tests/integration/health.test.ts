/**
 * GET /api/health against a live database and against one that has been stopped (a second throwaway cluster).
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { closeContext, createContext } from '../../server/server';
import type { AppContext } from '../../server/context';
import { healthSchema } from '../../shared/contracts/health';
import { startThrowawayCluster } from '../support/pg-cluster';
import { createTestApp, testEnv, type TestApp } from '../support/test-app';

let live: TestApp | undefined;
let stoppedCtx: AppContext | undefined;

afterAll(async () => {
  await live?.close();
  if (stoppedCtx) await closeContext(stoppedCtx);
});

describe('GET /api/health', () => {
  it('reports ok with a live database', async () => {
    live = await createTestApp();
    const response = await request(live.app).get('/api/health').expect(200);
    expect(healthSchema.parse(response.body)).toEqual({ status: 'ok', database: 'ok' });
  });

  it('reports a stopped database as down with 503', async () => {
    const cluster = await startThrowawayCluster();
    try {
      stoppedCtx = await createContext(testEnv(cluster.url), { seed: false });
    } finally {
      await cluster.stop();
    }
    const app = createApp(stoppedCtx, { clientDir: null });
    const started = Date.now();
    const response = await request(app).get('/api/health');
    expect(response.status).toBe(503);
    expect(healthSchema.parse(response.body)).toEqual({ status: 'degraded', database: 'down' });
    expect(Date.now() - started).toBeLessThan(5000);
  });
});
