import bcrypt from 'bcryptjs';
import { describe, expect, it } from 'vitest';
import { decoyHash, hashPassword, passwordHashCost, passwordNeedsRehash, verifyPassword } from './password';

describe('passwords', () => {
  it('the decoy hash for unknown e-mails costs as much as a real one', () => {
    expect(decoyHash.startsWith(`scrypt$${passwordHashCost}$8$1$`)).toBe(true);
    expect(passwordNeedsRehash(decoyHash)).toBe(false);
  });

  it('a stored hash accepts its password only; no hash accepts nothing', async () => {
    const hash = await hashPassword('correct-horse-battery', 4);
    expect(hash.startsWith('scrypt$4$8$1$')).toBe(true);
    expect(await verifyPassword('correct-horse-battery', hash)).toBe(true);
    expect(await verifyPassword('correct-horse-battery ', hash)).toBe(false);
    expect(await verifyPassword('correct-horse-battery', null)).toBe(false);
    expect(await verifyPassword('', undefined)).toBe(false);
    expect(await verifyPassword('correct-horse-battery', 'garbage')).toBe(false);
    // Two hashes of one password differ (random salt).
    expect(await hashPassword('correct-horse-battery', 4)).not.toBe(hash);
  });

  it('bcrypt hashes of earlier versions still verify and are marked for rehashing; scrypt hashes are not', async () => {
    const old = await bcrypt.hash('correct-horse-battery', 4);
    expect(await verifyPassword('correct-horse-battery', old)).toBe(true);
    expect(await verifyPassword('wrong', old)).toBe(false);
    expect(passwordNeedsRehash(old)).toBe(true);
    expect(passwordNeedsRehash(await hashPassword('x', 4))).toBe(false);
  });

  it('hashing at the full cost runs off the event loop: timers keep firing meanwhile', async () => {
    let ticks = 0;
    const timer = setInterval(() => (ticks += 1), 5);
    const started = performance.now();
    await Promise.all([hashPassword('a-long-password'), hashPassword('another-password')]);
    const elapsedMs = performance.now() - started;
    clearInterval(timer);
    // A blocked loop would fire the interval at most once or twice; a free one about every 5 ms.
    expect(ticks).toBeGreaterThan(Math.min(10, elapsedMs / 20));
  });
});
