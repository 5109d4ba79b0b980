import type { SignOff } from '../../../shared/contracts/sign-offs';

/**
 * What the project's sign-offs hold fast, by id: an approved design's mode, load cases and comfort criteria refuse
 * every change (docs/decisions/0019); those of a design waiting for the owner can change, but the owner can then
 * no longer approve it as submitted. Read from each sign-off's snapshot, which names what the design rests on.
 */
export interface DesignLocks {
  approved: ReadonlySet<string>;
  pending: ReadonlySet<string>;
}

export interface ModelLocks {
  modes: DesignLocks;
  loadCases: DesignLocks;
  criteria: DesignLocks;
}

export const noLocks: DesignLocks = { approved: new Set(), pending: new Set() };

export function designLocks(signOffs: readonly SignOff[] | undefined): ModelLocks {
  const sets = {
    modes: { approved: new Set<string>(), pending: new Set<string>() },
    loadCases: { approved: new Set<string>(), pending: new Set<string>() },
    criteria: { approved: new Set<string>(), pending: new Set<string>() },
  };
  for (const signOff of signOffs ?? []) {
    if (signOff.status === 'returned') continue;
    const which = signOff.status === 'approved' ? 'approved' : 'pending';
    sets.modes[which].add(signOff.snapshot.mode.id);
    for (const loadCase of signOff.snapshot.loadCases) sets.loadCases[which].add(loadCase.id);
    sets.criteria[which].add(signOff.criteriaId);
  }
  return sets;
}
