import bcrypt from 'bcryptjs';

/** bcrypt cost factor: about a tenth of a second per hash in pure JavaScript. */
export const passwordHashCost = 11;

export function hashPassword(password: string, cost = passwordHashCost): Promise<string> {
  return bcrypt.hash(password, cost);
}

/**
 * Compared against when the e-mail is unknown, so that a wrong e-mail costs as long as a wrong password. A fixed
 * hash (of 32 random bytes nobody kept) at passwordHashCost, so that no process spends a hash on it at start-up;
 * password.test.ts checks that its cost follows passwordHashCost.
 */
export const decoyHash = '$2b$11$.4obR7Y46Hc.hNbHgwojEeOtCVVkYDTN3qJQ67v4M/tVQfDWd990.';

export function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  return bcrypt.compare(password, hash ?? decoyHash).then((ok) => ok && Boolean(hash));
}
