import { describe, expect, it } from 'vitest';
import type { HistoryEvent } from '../../../../shared/contracts/history';
import { actorName, eventLines, eventSentence, fieldWords } from './describe-event';

const event = (over: Partial<HistoryEvent>): HistoryEvent => ({
  id: '00000000-0000-4000-8000-000000000001',
  at: '2026-03-01T10:00:00.000Z',
  by: { id: '00000000-0000-4000-8000-000000000002', name: 'Test Engineer', email: 'engineer@example.test' },
  entity: 'load-case',
  entityId: '00000000-0000-4000-8000-000000000003',
  label: 'Test crowd',
  action: 'update',
  changes: {},
  ...over,
});

describe('history entries in plain words', () => {
  it('names the person, the action and the thing', () => {
    expect(actorName(event({}))).toBe('Test Engineer');
    expect(actorName(event({ by: null }))).toBe('Set-up or script (no person)');
    expect(eventSentence(event({}))).toBe('changed the load case “Test crowd”');
    expect(eventSentence(event({ entity: 'sign-off', action: 'submitted', label: 'Test variant' }))).toBe('submitted the design “Test variant” for sign-off');
    expect(eventSentence(event({ entity: 'sign-off', action: 'approved', label: 'Test variant' }))).toBe('approved the design “Test variant”');
    expect(eventSentence(event({ entity: 'as-built-record', action: 'create', label: null }))).toBe('added the as-built record');
    // A kind of thing added later without a noun reads from its name.
    expect(eventSentence(event({ entity: 'damper-inspection', action: 'create', label: null }))).toBe('added the damper inspection');
  });

  it('reads the unit from the field name', () => {
    expect(fieldWords('frequencyHz')).toEqual({ words: 'frequency', unit: 'Hz' });
    expect(fieldWords('deckAreaM2')).toEqual({ words: 'deck area', unit: 'm²' });
    expect(fieldWords('densityPerM2')).toEqual({ words: 'density', unit: 'persons/m²' });
    expect(fieldWords('stiffnessMatrixNPerM')).toEqual({ words: 'stiffness matrix', unit: 'N/m' });
    expect(fieldWords('dampingRatio')).toEqual({ words: 'damping ratio' });
    expect(fieldWords('loadCaseIds')).toEqual({ words: 'load cases' });
  });

  it('compares nested values leaf by leaf and names referenced things', () => {
    const spec = { kind: 'crowd', guide: 'setra', densityPerM2: 0.5 };
    const lines = eventLines(event({ changes: { spec: { before: spec, after: { ...spec, densityPerM2: 0.8 } } } }), {});
    expect(lines).toEqual([{ what: 'density', before: '0.5 persons/m²', after: '0.8 persons/m²' }]);
    const a = '00000000-0000-4000-8000-00000000000a';
    const b = '00000000-0000-4000-8000-00000000000b';
    expect(eventLines(event({ changes: { loadCaseIds: { before: [a], after: [b, a] } } }), { [a]: 'Crowd', [b]: 'Walker' })).toEqual([
      { what: 'load cases', before: '“Crowd”', after: '“Walker”, “Crowd”' },
    ]);
    expect(eventLines(event({ changes: { fileBytes: { changed: true }, spanM: { after: 42 } } }), {})).toEqual([
      { what: 'file bytes', hiddenValue: true },
      { what: 'span', after: '42 m' },
    ]);
  });
});
