/**
 * Sign-off of a tuning variant by the organisation's owner, and the mail outbox. A sign-off copies everything the
 * approval rests on into `snapshot` at submission; the owner approves or returns it once (the decision is an
 * UPDATE … WHERE status = 'submitted'). Mails are written to `outbox` in the transaction of the decision and sent
 * after commit, with retries (docs/decisions/0019-sign-off-freeze.md).
 */
import { sql } from 'drizzle-orm';
import { check, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { SignOffSnapshot } from '../../../shared/contracts/sign-offs';
import { signOffStatuses, mailStates } from '../../../shared/contracts/sign-offs';
import { users } from './auth';
import { projects } from './projects';
import { comfortCriteria } from './structural-model';
import { tuningVariants } from './variants';

export const signOffStatusEnum = pgEnum('sign_off_status', signOffStatuses);

export const signOffs = pgTable(
  'sign_offs',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    /** Deleting a variant (never an approved one: the freeze refuses it) removes its sign-offs. */
    variantId: uuid()
      .notNull()
      .references(() => tuningVariants.id, { onDelete: 'cascade' }),
    criteriaId: uuid()
      .notNull()
      .references(() => comfortCriteria.id),
    status: signOffStatusEnum().notNull().default('submitted'),
    message: text(),
    submittedBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    submittedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    decidedBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    decidedAt: timestamp({ withTimezone: true }),
    decisionComment: text(),
    /**
     * Who decided and the project's name, as they were at the decision: the hardware sheet reads these, never the
     * person's or project's current row (a later rename does not change an approved sheet). Null before a decision,
     * and on sign-offs decided before these were kept.
     */
    decidedByName: text(),
    decidedByEmail: text(),
    decidedProjectName: text(),
    /** The variant, its mode, load cases, criteria and computed result as they were at submission. */
    snapshot: jsonb().$type<SignOffSnapshot>().notNull(),
    version: integer().notNull().default(1),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('sign_offs_project_idx').on(table.projectId, table.submittedAt),
    index('sign_offs_variant_idx').on(table.variantId),
    index('sign_offs_criteria_idx').on(table.criteriaId),
    /** At most one undecided sign-off per variant (the service answers 409 first; the index covers the race). */
    uniqueIndex('sign_offs_one_submitted_per_variant').on(table.variantId).where(sql`${table.status} = 'submitted'`),
    check('sign_offs_decided', sql`(${table.status} = 'submitted') = (${table.decidedAt} is null)`),
    check('sign_offs_return_comment', sql`${table.status} <> 'returned' or length(trim(coalesce(${table.decisionComment}, ''))) > 0`),
    check('sign_offs_version_positive', sql`${table.version} >= 1`),
  ],
);

export const mailStateEnum = pgEnum('mail_state', mailStates);

/** Mails waiting to be sent, sent, or given up after the last retry. */
export const outbox = pgTable(
  'outbox',
  {
    id: uuid().primaryKey().defaultRandom(),
    signOffId: uuid().references(() => signOffs.id, { onDelete: 'cascade' }),
    toAddress: text().notNull(),
    subject: text().notNull(),
    textBody: text().notNull(),
    htmlBody: text(),
    state: mailStateEnum().notNull().default('pending'),
    attempts: integer().notNull().default(0),
    nextAttemptAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    lastError: text(),
    sentAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('outbox_due_idx').on(table.nextAttemptAt).where(sql`${table.state} = 'pending'`),
    index('outbox_sign_off_idx').on(table.signOffId),
    check('outbox_attempts', sql`${table.attempts} >= 0`),
  ],
);
