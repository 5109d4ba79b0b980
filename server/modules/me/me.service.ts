import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { users } from '../../db/schema';
import { hashPassword, verifyPassword } from '../../auth/password';
import { invalidField } from '../../lib/http-error';
import type { CurrentUser } from '../../middleware/auth';
import type { ChangePasswordInput } from '../../../shared/contracts/me';
import { findUserById } from '../users/users.repository';

/** Replaces the person's password after checking the current one. Open sessions stay signed in. */
export async function changePassword(db: Database, user: CurrentUser, input: ChangePasswordInput): Promise<void> {
  const row = await findUserById(db, user.id);
  if (!(await verifyPassword(input.currentPassword, row?.passwordHash))) {
    throw invalidField('currentPassword', 'is not your current password');
  }
  if (input.newPassword === input.currentPassword) throw invalidField('newPassword', 'must differ from the current password');
  await db.update(users).set({ passwordHash: await hashPassword(input.newPassword) }).where(eq(users.id, user.id));
}
