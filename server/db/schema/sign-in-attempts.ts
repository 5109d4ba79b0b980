import { index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Counts of sign-in attempts per key within a fixed window, shared by every server process: one row per key (the
 * SHA-256 of "pair:<e-mail>|<client address>" or "client:<client address>", so no address is stored in clear),
 * counted atomically with INSERT … ON CONFLICT … DO UPDATE … RETURNING (server/auth/sign-in-throttle.ts).
 */
export const signInAttempts = pgTable(
  'sign_in_attempts',
  {
    key: text().primaryKey(),
    count: integer().notNull(),
    windowStartedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index('sign_in_attempts_window_idx').on(table.windowStartedAt)],
);
