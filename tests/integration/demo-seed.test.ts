/**
 * The invented demo: seeded into an empty database only, with the documented accounts and password, and usable
 * at once (the demo engineer signs in and creates a project; the fabricator may not).
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import type { AppContext } from '../../server/context';
import { demoAccounts, demoPassword, seedDemoIfEmpty } from '../../server/db/seed';
import { organisations, projects } from '../../server/db/schema';
import { closeContext, createContext } from '../../server/server';
import { appConfigSchema } from '../../shared/contracts/app-config';
import { projectListSchema } from '../../shared/contracts/projects';
import { clusterUrl, ensureDatabase } from '../support/pg-cluster';
import { dropDatabase, signIn, testEnv } from '../support/test-app';

let ctx: AppContext;
const name = `seed_${randomUUID().replace(/-/g, '')}`;

beforeAll(async () => {
  await ensureDatabase(inject('pgPort'), name, inject('pgTemplate'));
  ctx = await createContext(testEnv(clusterUrl(inject('pgPort'), name)), { seed: false });
});

afterAll(async () => {
  if (ctx) await closeContext(ctx);
  await dropDatabase(inject('pgPort'), name);
});

describe('demo seed', () => {
  it('fills an empty database once', async () => {
    expect(await seedDemoIfEmpty(ctx.db)).toBe(true);
    expect(await seedDemoIfEmpty(ctx.db)).toBe(false);
    const orgs = await ctx.db.select().from(organisations);
    expect(orgs.map((o) => o.name)).toEqual([expect.stringContaining('invented')]);
    const rows = await ctx.db.select().from(projects);
    expect(rows.map((p) => p.kind).sort()).toEqual(['floor', 'footbridge']);
    expect(rows.every((p) => /invented/i.test(p.description ?? '') && /invented/i.test(p.location ?? ''))).toBe(true);
  });

  it('documents the five accounts and the password in /api/config outside production', async () => {
    const app = createApp(ctx, { clientDir: null });
    const config = appConfigSchema.parse((await request(app).get('/api/config').expect(200)).body);
    expect(config).toMatchObject({ mode: 'test', demoPassword: 'stillspan-demo', devMailbox: true });
    expect(config.demoAccounts).toEqual([
      { email: 'admin@demo.stillspan.test', role: 'admin' },
      { email: 'engineer@demo.stillspan.test', role: 'engineer' },
      { email: 'owner@demo.stillspan.test', role: 'owner' },
      { email: 'fabricator@demo.stillspan.test', role: 'fabricator' },
      { email: 'viewer@demo.stillspan.test', role: 'viewer' },
    ]);
  });

  it.each(demoAccounts)('$email signs in with the documented password and has the role $role', async ({ email, role }) => {
    const app = createApp(ctx, { clientDir: null });
    const agent = await signIn(app, email, demoPassword);
    expect((await agent.get('/api/me').expect(200)).body.role).toBe(role);
    // Every member of the organisation reads all its projects: both demo projects.
    expect(projectListSchema.parse((await agent.get('/api/projects').expect(200)).body).projects).toHaveLength(2);
  });

  it('the demo engineer creates a project; the demo fabricator gets 403', async () => {
    const app = createApp(ctx, { clientDir: null });
    const engineer = await signIn(app, 'engineer@demo.stillspan.test', 'stillspan-demo');
    const created = await engineer.post('/api/projects').send({ name: 'Demo engineer’s new bay', kind: 'floor' }).expect(201);
    expect(created.body.name).toBe('Demo engineer’s new bay');
    const fabricator = await signIn(app, 'fabricator@demo.stillspan.test', 'stillspan-demo');
    await fabricator.post('/api/projects').send({ name: 'Not allowed', kind: 'floor' }).expect(403);
  });
});
