import bcrypt from 'bcryptjs';
import { describe, expect, it } from 'vitest';
import { decoyHash, hashPassword, passwordHashCost, verifyPassword } from './password';

describe('passwords', () => {
  it('the decoy hash for unknown e-mails costs as much as a real one', () => {
    expect(bcrypt.getRounds(decoyHash)).toBe(passwordHashCost);
  });

  it('a stored hash accepts its password only; no hash accepts nothing', async () => {
    const hash = await hashPassword('correct-horse-battery', 4);
    expect(bcrypt.getRounds(hash)).toBe(4);
    expect(await verifyPassword('correct-horse-battery', hash)).toBe(true);
    expect(await verifyPassword('correct-horse-battery ', hash)).toBe(false);
    expect(await verifyPassword('correct-horse-battery', null)).toBe(false);
    expect(await verifyPassword('', undefined)).toBe(false);
  });
});
