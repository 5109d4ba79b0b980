import { describe, expect, it, vi } from 'vitest';
import { ApiError } from './api-client';
import { applyServerIssues } from './form-errors';

type Values = { name: string; tmds: { massKg: number }[] };
const fields = ['name', 'tmds'] as const;

describe('applyServerIssues', () => {
  it('puts each issue under its field (or the field above it) and returns the rest for the notice', () => {
    const setError = vi.fn();
    const error = new ApiError(400, 'invalid_request', 'The request is not valid.', [
      { path: 'tmds.0.massKg', message: 'tmds.0.massKg: must be positive' },
      { path: 'name', message: 'name: is required' },
      { path: 'colour', message: 'colour: is not a known field' },
    ]);
    expect(applyServerIssues<Values>(error, fields, setError)).toBe('colour: is not a known field');
    expect(setError.mock.calls).toEqual([
      ['name', { type: 'server', message: 'is required' }, { shouldFocus: true }],
      ['tmds', { type: 'server', message: 'must be positive' }, { shouldFocus: false }],
    ]);
  });

  it('returns null when every issue found its field', () => {
    const error = new ApiError(400, 'invalid_request', 'The request is not valid.', [{ path: 'name', message: 'name: is required' }]);
    expect(applyServerIssues<Values>(error, fields, vi.fn())).toBeNull();
  });

  it("returns the error's own message when it names no field", () => {
    const setError = vi.fn();
    expect(applyServerIssues<Values>(new ApiError(409, 'conflict', 'Someone changed it.'), fields, setError)).toBe('Someone changed it.');
    expect(applyServerIssues<Values>(new Error('offline'), fields, setError)).toBe('offline');
    expect(setError).not.toHaveBeenCalled();
  });
});
