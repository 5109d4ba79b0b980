import bcrypt from 'bcryptjs';

/** bcrypt cost factor: about a tenth of a second per hash in pure JavaScript. */
export const passwordHashCost = 11;

export function hashPassword(password: string, cost = passwordHashCost): Promise<string> {
  return bcrypt.hash(password, cost);
}

// Compared against when the e-mail is unknown, so that a wrong e-mail costs as long as a wrong password.
const decoyHash = bcrypt.hashSync('decoy-password-never-used', passwordHashCost);

export function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  return bcrypt.compare(password, hash ?? decoyHash).then((ok) => ok && Boolean(hash));
}
