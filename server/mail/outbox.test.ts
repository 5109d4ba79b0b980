import { describe, expect, it } from 'vitest';
import { claimSecondsFor, outboxMaxAttempts, retryDelayS } from './outbox';

// The outbox's retry schedule is our own choice (docs/decisions/0019-sign-off-freeze.md), not a published figure.
describe('the outbox retry schedule', () => {
  it('waits 30 s after the first failure and doubles after each further one', () => {
    expect([1, 2, 3, 4].map(retryDelayS)).toEqual([30, 60, 120, 240]);
  });

  it('never waits more than an hour, and gives up after ten attempts', () => {
    expect(retryDelayS(8)).toBe(3600);
    expect(retryDelayS(outboxMaxAttempts)).toBe(3600);
    expect(outboxMaxAttempts).toBe(10);
  });

  it('holds the mails of a round away from other relays for longer than the slowest round takes', () => {
    // Our own rule: 50 mails each sent just within 15 s take 750 s; the claim adds a minute to that.
    expect(claimSecondsFor(50, 15_000)).toBe(810);
    expect(claimSecondsFor(1, 4_000)).toBe(64);
    expect(claimSecondsFor(50, 15_000)).toBeGreaterThan((50 * 15_000) / 1000);
  });
});
