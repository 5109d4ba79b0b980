import { describe, expect, it } from 'vitest';
import { fieldName, toHistoryEvent } from './history.service';

describe('history entries in the API', () => {
  it('renames the recorded columns to the API field names', () => {
    expect(fieldName('deck_area_m2')).toBe('deckAreaM2');
    expect(fieldName('stiffness_matrix_n_per_m')).toBe('stiffnessMatrixNPerM');
    expect(fieldName('load_case_ids')).toBe('loadCaseIds');
    expect(fieldName('name')).toBe('name');
  });

  it('says no person when none was recorded, and keeps the name recorded at the time', () => {
    const row = {
      id: '00000000-0000-4000-8000-000000000001',
      seq: 1,
      projectId: '00000000-0000-4000-8000-000000000002',
      at: new Date('2026-03-01T10:00:00Z'),
      actorId: null,
      actorName: null,
      actorEmail: null,
      entity: 'structure',
      entityId: '00000000-0000-4000-8000-000000000003',
      label: 'Test span',
      action: 'update',
      changes: { span_m: { before: 30, after: 34 } },
      transactionId: 7,
    };
    expect(toHistoryEvent(row)).toEqual({
      id: row.id,
      at: '2026-03-01T10:00:00.000Z',
      by: null,
      entity: 'structure',
      entityId: row.entityId,
      label: 'Test span',
      action: 'update',
      changes: { spanM: { before: 30, after: 34 } },
    });
    // A person removed since: the id is gone (on delete set null), the name and e-mail stay.
    expect(toHistoryEvent({ ...row, actorName: 'Former Engineer', actorEmail: 'former@example.test' }).by).toEqual({
      id: null,
      name: 'Former Engineer',
      email: 'former@example.test',
    });
  });
});
