import { describe, expect, it } from 'vitest';
import type { SignOff } from '../../../shared/contracts/sign-offs';
import { designLocks } from './design-locks';

/** Only the fields designLocks reads; the rest of a sign-off does not matter here. */
function signOff(status: SignOff['status'], modeId: string, loadCaseIds: string[], criteriaId: string): SignOff {
  return {
    status,
    criteriaId,
    snapshot: { mode: { id: modeId }, loadCases: loadCaseIds.map((id) => ({ id })) },
  } as unknown as SignOff;
}

describe('designLocks', () => {
  it('fixes what an approved design rests on, marks what a submitted one rests on, and ignores returned ones', () => {
    const locks = designLocks([
      signOff('approved', 'mode-a', ['crowd', 'walker'], 'criteria-a'),
      signOff('submitted', 'mode-b', ['walker', 'jogger'], 'criteria-b'),
      signOff('returned', 'mode-c', ['lateral'], 'criteria-c'),
    ]);
    expect([...locks.modes.approved]).toEqual(['mode-a']);
    expect([...locks.modes.pending]).toEqual(['mode-b']);
    expect([...locks.loadCases.approved].sort()).toEqual(['crowd', 'walker']);
    expect([...locks.loadCases.pending].sort()).toEqual(['jogger', 'walker']);
    expect([...locks.criteria.approved]).toEqual(['criteria-a']);
    expect([...locks.criteria.pending]).toEqual(['criteria-b']);
    expect(locks.modes.approved.has('mode-c') || locks.modes.pending.has('mode-c')).toBe(false);
  });

  it('locks nothing while the sign-offs are unknown', () => {
    const locks = designLocks(undefined);
    expect(locks.modes.approved.size + locks.loadCases.approved.size + locks.criteria.approved.size).toBe(0);
  });
});
