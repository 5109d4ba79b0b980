import { describe, expect, it } from 'vitest';
import { frozenResultNotice } from './frozen-result';

describe('the notice of an approved result from an earlier engine version', () => {
  it('says nothing for a result computed by the running engine', () => {
    expect(frozenResultNotice({ stale: false, engineVersion: '2026.12-1', computedAt: '2026-12-01T10:00:00Z' })).toBeNull();
    expect(frozenResultNotice(null)).toBeNull();
  });

  it('names the engine version of a frozen result and says it is not recomputed', () => {
    const notice = frozenResultNotice({ stale: true, engineVersion: '2026.01-0', computedAt: '2026-01-05T10:00:00Z' });
    expect(notice?.title).toBe('Approved result from an earlier engine version');
    expect(notice?.body).toContain('engine version 2026.01-0');
    expect(notice?.body).toContain('not computed again');
    expect(notice?.body).toContain('copy the variant');
  });
});
