/**
 * Odd input to the structural model and the tuning variants is a 4xx naming the field, never a 500: a NUL character
 * in typed text (no text column can store one) and a version beyond the database's integer.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;
let projectId: string;
let structureId: string;

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signIn(t.app, t.people.engineer.email);
  projectId = (await engineer.post('/api/projects').send({ name: 'Odd input to the model', kind: 'footbridge' }).expect(201)).body.id;
  structureId = (await engineer.post(`/api/projects/${projectId}/structures`).send({ name: 'Span', kind: 'footbridge-span' }).expect(201)).body.id;
});

afterAll(async () => {
  await t?.close();
});

function issuePaths(body: { error: { issues: { path: string }[] } }): string[] {
  return [...new Set(body.error.issues.map((issue) => issue.path))];
}

describe('a NUL character in typed text', () => {
  it('is 400 naming the field for a structure, a mode, a load case, comfort criteria and a tuning variant', async () => {
    const cases: [string, Record<string, unknown>, string][] = [
      [`/api/projects/${projectId}/structures`, { name: 'A\u0000B', kind: 'footbridge-span' }, 'name'],
      [`/api/projects/${projectId}/structures`, { name: 'Fine', kind: 'footbridge-span', notes: '\u0000' }, 'notes'],
      [
        `/api/projects/${projectId}/structures/${structureId}/modes`,
        { label: 'First\u0000vertical', direction: 'vertical', frequencyHz: 1.9, modalMassKg: 40_000, dampingRatio: 0.005 },
        'label',
      ],
      [`/api/projects/${projectId}/load-cases`, { name: 'W\u0000', spec: { kind: 'walker' } }, 'name'],
      [`/api/projects/${projectId}/comfort-criteria`, { name: 'C\u0000', spec: { set: 'en1990', class: 'normal-use' } }, 'name'],
      [
        `/api/projects/${projectId}/variants`,
        { name: 'V\u0000', modeId: crypto.randomUUID(), loadCaseIds: [crypto.randomUUID()], criteriaId: crypto.randomUUID(), massRatio: 0.02, tuning: { method: 'den-hartog' } },
        'name',
      ],
    ];
    for (const [path, body, field] of cases) {
      const response = await engineer.post(path).send(body);
      expect(response.status, `${path} ${field}`).toBe(400);
      expect(issuePaths(response.body), `${path} ${field}`).toContain(field);
    }
    expect((await engineer.get(`/api/projects/${projectId}/structures`).expect(200)).body.structures).toHaveLength(1);
  });
});

describe('a version beyond the database integer', () => {
  it('is 400 naming version, and the structure is unchanged', async () => {
    for (const version of [2_147_483_648, 2 ** 53]) {
      const response = await engineer.patch(`/api/projects/${projectId}/structures/${structureId}`).send({ version, name: 'Overflow' });
      expect(response.status, String(version)).toBe(400);
      expect(issuePaths(response.body)).toEqual(['version']);
    }
    expect((await engineer.get(`/api/projects/${projectId}/structures/${structureId}`).expect(200)).body.name).toBe('Span');
  });
});
