import { describe, expect, it } from 'vitest';
import { ApiError } from '../../lib/api-client';
import { changesSomething, sameValue, saveRefusalOf } from './changes';

describe('sameValue', () => {
  it('compares nested JSON-like values whatever the key order, and reads an undefined key as absent', () => {
    expect(sameValue({ kind: 'beam', lengthM: 42, band: [1.6, 2.4] }, { band: [1.6, 2.4], lengthM: 42, kind: 'beam' })).toBe(true);
    expect(sameValue({ kind: 'walker', bodyWeightN: undefined }, { kind: 'walker' })).toBe(true);
    expect(sameValue({ band: [1.6, 2.4] }, { band: [1.6, 2.5] })).toBe(false);
    expect(sameValue({ modeShapeMean: null }, { modeShapeMean: 0.637 })).toBe(false);
    expect(sameValue([1, 2], { 0: 1, 1: 2 })).toBe(false);
  });
});

describe('changesSomething', () => {
  it('is false for a body that names only the version', () => {
    expect(changesSomething({ version: 3 })).toBe(false);
    expect(changesSomething({ version: 3, label: undefined } as { version: number })).toBe(false);
    expect(changesSomething({ version: 3, modeShapeMean: null } as { version: number })).toBe(true);
  });
});

describe('saveRefusalOf', () => {
  it('tells a version conflict and an approved design apart from other refusals', () => {
    expect(saveRefusalOf(new ApiError(409, 'version_conflict', 'The mode was changed by someone else'))).toEqual({ kind: 'conflict' });
    const frozen = 'The mode belongs to a design the owner approved and cannot be changed or deleted; copy the variant and submit again';
    expect(saveRefusalOf(new ApiError(409, 'approved_design_frozen', frozen))).toEqual({ kind: 'frozen', message: frozen });
    expect(saveRefusalOf(new ApiError(409, 'derived_mode_conflict', 'The model lost the mode'))).toBeNull();
    expect(saveRefusalOf(new ApiError(400, 'invalid_request', 'The request is not valid.'))).toBeNull();
    expect(saveRefusalOf(new Error('offline'))).toBeNull();
  });
});
