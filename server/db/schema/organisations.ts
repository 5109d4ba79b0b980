import { pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { roles } from '../../../shared/contracts/roles';
import { users } from './auth';

export const roleEnum = pgEnum('role', roles);

export const organisations = pgTable('organisations', {
  id: uuid().primaryKey().defaultRandom(),
  name: text().notNull(),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

/** A person's place in an organisation. A person belongs to one organisation (unique user). */
export const memberships = pgTable(
  'memberships',
  {
    organisationId: uuid()
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: roleEnum().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.organisationId, table.userId] }), uniqueIndex('memberships_user_unique').on(table.userId)],
);

/** An e-mailed invitation. Only the SHA-256 of the token is stored; the token itself travels in the mail. */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid().primaryKey().defaultRandom(),
    organisationId: uuid()
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    email: text().notNull(),
    name: text(),
    role: roleEnum().notNull(),
    tokenHash: text().notNull(),
    invitedBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    acceptedAt: timestamp({ withTimezone: true }),
  },
  (table) => [uniqueIndex('invitations_token_hash_unique').on(table.tokenHash)],
);
