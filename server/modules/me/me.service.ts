import type { Database } from '../../db/client';
import { hashPassword, verifyPassword } from '../../auth/password';
import { HttpError, invalidField } from '../../lib/http-error';
import type { CurrentUser } from '../../middleware/auth';
import type { ChangePasswordInput } from '../../../shared/contracts/me';
import { findUserById, setPasswordEndingSessions } from '../users/users.repository';

/**
 * Replaces the person's password after checking the current one, and ends every session of theirs (the session
 * generation goes up); returns the new generation, with which the router re-issues the caller's own session.
 */
export async function changePassword(db: Database, user: CurrentUser, input: ChangePasswordInput): Promise<number> {
  const row = await findUserById(db, user.id);
  if (!(await verifyPassword(input.currentPassword, row?.passwordHash))) {
    throw invalidField('currentPassword', 'is not your current password');
  }
  if (input.newPassword === input.currentPassword) throw invalidField('newPassword', 'must differ from the current password');
  const generation = await setPasswordEndingSessions(db, user.id, await hashPassword(input.newPassword));
  if (generation === undefined) throw new HttpError(401, 'unauthenticated', 'Your account is no longer active; sign in again');
  return generation;
}
