/**
 * A small design for the integration tests, made through the API the way an engineer makes one: a footbridge project
 * with one structure and its mode, a crowd and a single-walker load case and comfort criteria, and tuning variants on
 * them. Test inputs (invented); each test file may change any of them.
 */
import { expect } from 'vitest';
import { projectSchema } from '../../shared/contracts/projects';
import { variantSchema, type Variant } from '../../shared/contracts/variants';
import type { Agent } from './test-app';

export const testMode = { label: 'Test vertical mode', direction: 'vertical', frequencyHz: 2.0, modalMassKg: 30_000, dampingRatio: 0.005, modeShapeMean: 0.6 };
export const testCrowdSpec = { kind: 'crowd', guide: 'setra', densityPerM2: 0.8, deckAreaM2: 120, harmonic: 1 };
export const testWalkerSpec = { kind: 'walker' };
export const testCriteriaSpec = { set: 'setra', class: 'maximum' };

export interface TestDesignInputs {
  mode?: Record<string, unknown>;
  crowdSpec?: Record<string, unknown>;
  walkerSpec?: Record<string, unknown>;
  criteriaSpec?: Record<string, unknown>;
}

export interface TestDesignIds {
  projectId: string;
  structureId: string;
  modeId: string;
  crowdId: string;
  walkerId: string;
  criteriaId: string;
}

/** A structure with its mode, the two load cases and the criteria, in a project that exists. */
export async function populateTestDesign(agent: Agent, projectId: string, inputs: TestDesignInputs = {}): Promise<TestDesignIds> {
  const structureId = (await agent.post(`/api/projects/${projectId}/structures`).send({ name: 'Test span', kind: 'footbridge-span' }).expect(201)).body.id as string;
  const modeId = (await agent.post(`/api/projects/${projectId}/structures/${structureId}/modes`).send(inputs.mode ?? testMode).expect(201)).body.id as string;
  const crowdId = (await agent.post(`/api/projects/${projectId}/load-cases`).send({ name: 'Test crowd', spec: inputs.crowdSpec ?? testCrowdSpec }).expect(201)).body
    .id as string;
  const walkerId = (await agent.post(`/api/projects/${projectId}/load-cases`).send({ name: 'Test walker', spec: inputs.walkerSpec ?? testWalkerSpec }).expect(201))
    .body.id as string;
  const criteriaId = (
    await agent
      .post(`/api/projects/${projectId}/comfort-criteria`)
      .send({ name: 'Test criteria', spec: inputs.criteriaSpec ?? testCriteriaSpec })
      .expect(201)
  ).body.id as string;
  return { projectId, structureId, modeId, crowdId, walkerId, criteriaId };
}

/** A new footbridge project holding the test design. */
export async function newTestDesignProject(agent: Agent, name: string, inputs: TestDesignInputs = {}): Promise<TestDesignIds> {
  const projectId = projectSchema.parse((await agent.post('/api/projects').send({ name, kind: 'footbridge' }).expect(201)).body).id;
  return populateTestDesign(agent, projectId, inputs);
}

/** A Den Hartog variant at 2 % on the mode, both load cases and the criteria; `over` replaces any field. */
export function testVariantBody(ids: TestDesignIds, over: Record<string, unknown> = {}) {
  return {
    name: 'Test Den Hartog 2 %',
    modeId: ids.modeId,
    loadCaseIds: [ids.crowdId, ids.walkerId],
    criteriaId: ids.criteriaId,
    massRatio: 0.02,
    tuning: { method: 'den-hartog' },
    ...over,
  };
}

export async function createTestVariant(agent: Agent, ids: TestDesignIds, over: Record<string, unknown> = {}): Promise<Variant> {
  const response = await agent.post(`/api/projects/${ids.projectId}/variants`).send(testVariantBody(ids, over));
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return variantSchema.parse(response.body);
}
