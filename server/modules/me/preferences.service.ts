import { eq, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { userPreferences } from '../../db/schema';
import type { CurrentUser } from '../../middleware/auth';
import type { Preferences, UpdatePreferencesInput } from '../../../shared/contracts/preferences';

const defaults: Preferences = { unitSystem: 'si' };

/** The person's display preferences (SI until they choose otherwise). */
export async function getPreferences(db: Database, user: CurrentUser): Promise<Preferences> {
  const [row] = await db.select().from(userPreferences).where(eq(userPreferences.userId, user.id)).limit(1);
  return row ? { unitSystem: row.unitSystem } : defaults;
}

/** Changes the given preferences; the others keep their value. */
export async function updatePreferences(db: Database, user: CurrentUser, input: UpdatePreferencesInput): Promise<Preferences> {
  const current = await getPreferences(db, user);
  const next: Preferences = { ...current, ...Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)) };
  await db
    .insert(userPreferences)
    .values({ userId: user.id, unitSystem: next.unitSystem })
    .onConflictDoUpdate({ target: userPreferences.userId, set: { unitSystem: next.unitSystem, updatedAt: sql`now()` } });
  return next;
}
