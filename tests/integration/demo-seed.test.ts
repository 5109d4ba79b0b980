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
import { comfortCriteria, loadCases, lumpedModels, organisations, projects, structureModes, structures } from '../../server/db/schema';
import { closeContext, createContext } from '../../server/server';
import { appConfigSchema } from '../../shared/contracts/app-config';
import { projectListSchema } from '../../shared/contracts/projects';
import { comfortCriteriaListSchema, loadCaseListSchema, lumpedModelListSchema, modeListSchema, structureListSchema } from '../../shared/contracts/model';
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

  it('gives each demo project an invented structure with typed and derived modes, load cases and comfort criteria', async () => {
    const rows = await ctx.db.select().from(projects);
    const byKind = Object.fromEntries(rows.map((p) => [p.kind, p.id]));
    const allStructures = await ctx.db.select().from(structures);
    expect(allStructures.map((s) => s.kind).sort()).toEqual(['floor-bay', 'footbridge-span']);
    expect(allStructures.every((s) => /invented/i.test(s.notes ?? ''))).toBe(true);
    const footbridge = allStructures.find((s) => s.projectId === byKind.footbridge)!;
    const floor = allStructures.find((s) => s.projectId === byKind.floor)!;
    const modes = await ctx.db.select().from(structureModes);
    const kindsOf = (structureId: string) => modes.filter((m) => m.structureId === structureId).map((m) => m.source.kind).sort();
    expect(kindsOf(footbridge.id)).toEqual(['beam', 'lumped-model', 'typed', 'typed']);
    expect(kindsOf(floor.id)).toEqual(['beam', 'typed']);
    // The beam-derived mode holds the handbook numbers: f = π/(2L²)·√(EI/m), modal mass mL/2 (simply supported).
    const beam = modes.find((m) => m.structureId === footbridge.id && m.source.kind === 'beam')!;
    if (beam.source.kind !== 'beam') throw new Error('unreachable');
    const { lengthM, bendingStiffnessNM2, massPerLengthKgPerM } = beam.source;
    expect(beam.frequencyHz).toBeCloseTo((Math.PI / (2 * lengthM ** 2)) * Math.sqrt(bendingStiffnessNM2 / massPerLengthKgPerM), 10);
    expect(beam.modalMassKg).toBeCloseTo((massPerLengthKgPerM * lengthM) / 2, 3);
    // The girder lumped at its quarter points gives nearly the same first mode (common practice: a lumped beam
    // converges on the continuous one; three masses are within a few per cent).
    const lumped = modes.find((m) => m.source.kind === 'lumped-model')!;
    expect(lumped.lumpedModelId).toBe((await ctx.db.select().from(lumpedModels))[0].id);
    expect(Math.abs(lumped.frequencyHz / beam.frequencyHz - 1)).toBeLessThan(0.02);
    expect(Math.abs(lumped.modalMassKg / beam.modalMassKg - 1)).toBeLessThan(0.02);
    const cases = await ctx.db.select().from(loadCases);
    expect(cases.filter((c) => c.projectId === byKind.footbridge).map((c) => c.spec.kind).sort()).toEqual(['crowd', 'lateral', 'walker']);
    expect(cases.filter((c) => c.projectId === byKind.floor).map((c) => c.spec.kind)).toEqual(['floor-walking']);
    const criteria = await ctx.db.select().from(comfortCriteria);
    expect(criteria.map((c) => [c.projectId === byKind.footbridge ? 'footbridge' : 'floor', c.spec.set, c.status]).sort()).toEqual([
      ['floor', 'dg11', 'draft'],
      ['footbridge', 'setra', 'draft'],
    ]);
  });

  it('the demo viewer reads the structural model through the API, in the shapes the client expects', async () => {
    const app = createApp(ctx, { clientDir: null });
    const viewer = await signIn(app, 'viewer@demo.stillspan.test', demoPassword);
    const { projects: list } = projectListSchema.parse((await viewer.get('/api/projects').expect(200)).body);
    const footbridge = list.find((p) => p.kind === 'footbridge')!;
    const [structure] = structureListSchema.parse((await viewer.get(`/api/projects/${footbridge.id}/structures`).expect(200)).body).structures;
    const base = `/api/projects/${footbridge.id}/structures/${structure.id}`;
    expect(modeListSchema.parse((await viewer.get(`${base}/modes`).expect(200)).body).modes).toHaveLength(4);
    const [model] = lumpedModelListSchema.parse((await viewer.get(`${base}/models`).expect(200)).body).models;
    expect(model.modes).toHaveLength(3);
    expect(loadCaseListSchema.parse((await viewer.get(`/api/projects/${footbridge.id}/load-cases`).expect(200)).body).loadCases).toHaveLength(3);
    expect(comfortCriteriaListSchema.parse((await viewer.get(`/api/projects/${footbridge.id}/comfort-criteria`).expect(200)).body).comfortCriteria).toHaveLength(1);
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
