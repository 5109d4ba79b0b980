/**
 * The invented demo's tuning variants: two per demo project, labelled invented, whose results are computed on the
 * first read and agree with the assess command.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createApp } from '../../server/app';
import type { AppContext } from '../../server/context';
import { seedDemoIfEmpty } from '../../server/db/seed';
import { closeContext, createContext } from '../../server/server';
import { projectListSchema } from '../../shared/contracts/projects';
import { modeListSchema, structureListSchema } from '../../shared/contracts/model';
import { variantListSchema } from '../../shared/contracts/variants';
import { assessResponseSchema } from '../../shared/contracts/compute-design';
import { clusterUrl, ensureDatabase } from '../support/pg-cluster';
import { dropDatabase, signIn, testEnv } from '../support/test-app';

let ctx: AppContext;
const name = `seedvariants_${randomUUID().replace(/-/g, '')}`;

beforeAll(async () => {
  await ensureDatabase(inject('pgPort'), name, inject('pgTemplate'));
  ctx = await createContext(testEnv(clusterUrl(inject('pgPort'), name)), { seed: false });
  expect(await seedDemoIfEmpty(ctx.db)).toBe(true);
});

afterAll(async () => {
  if (ctx) await closeContext(ctx);
  await dropDatabase(inject('pgPort'), name);
});

describe('demo tuning variants', () => {
  it('gives each demo project two invented variants with results equal to assess on the same inputs', async () => {
    const app = createApp(ctx, { clientDir: null });
    const viewer = await signIn(app, 'viewer@demo.stillspan.test', 'stillspan-demo');
    const { projects } = projectListSchema.parse((await viewer.get('/api/projects').expect(200)).body);
    expect(projects).toHaveLength(2);
    for (const project of projects) {
      const { variants } = variantListSchema.parse((await viewer.get(`/api/projects/${project.id}/variants`).expect(200)).body);
      expect(variants.map((v) => v.tuning)).toEqual([{ method: 'den-hartog' }, { method: 'hinf' }]);
      expect(variants.every((v) => /invented/i.test(v.name) && /invented/i.test(v.notes ?? ''))).toBe(true);
      const [structure] = structureListSchema.parse((await viewer.get(`/api/projects/${project.id}/structures`).expect(200)).body).structures;
      const { modes } = modeListSchema.parse((await viewer.get(`/api/projects/${project.id}/structures/${structure.id}/modes`).expect(200)).body);
      for (const variant of variants) {
        expect(variant.result?.stale).toBe(false);
        expect(variant.resultError).toBeNull();
        const mode = modes.find((m) => m.id === variant.modeId);
        expect(mode).toBeDefined();
        if (!mode || !variant.result) continue;
        const loadCase = (await viewer.get(`/api/projects/${project.id}/load-cases/${variant.loadCaseIds[0]}`).expect(200)).body as { spec: Record<string, unknown> };
        const criteria = (await viewer.get(`/api/projects/${project.id}/comfort-criteria/${variant.criteriaId}`).expect(200)).body as { spec: unknown };
        const spec = loadCase.spec.kind === 'crowd' && loadCase.spec.modeShapeMean === undefined ? { ...loadCase.spec, modeShapeMean: mode.modeShapeMean } : loadCase.spec;
        const answer = assessResponseSchema.parse(
          (await viewer
            .post('/api/compute/assess')
            .send({
              structure: { modalMassKg: mode.modalMassKg, frequencyHz: mode.frequencyHz, dampingRatio: mode.dampingRatio, direction: mode.direction },
              tmds: [variant.result.tmd],
              loadCase: spec,
              criteria: criteria.spec,
              hardware: { unitCount: variant.unitCount },
            })
            .expect(200)).body,
        );
        expect(variant.result.loadCases[0].peakAccelerationMPerS2).toBe(answer.peakAccelerationMPerS2);
        expect(variant.result.loadCases[0].utilisation).toBe(answer.utilisation);
      }
      // A second read serves the stored result (same hash and computation time).
      const again = variantListSchema.parse((await viewer.get(`/api/projects/${project.id}/variants`).expect(200)).body).variants;
      expect(again.map((v) => v.result?.computedAt)).toEqual(variants.map((v) => v.result?.computedAt));
    }
  });
});
