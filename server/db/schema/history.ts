/**
 * The project's history: one row per change of a project's things, written by the row triggers of migration 0009 in
 * the transaction of the change (docs/decisions/0020-history.md). Nothing in the application inserts here.
 */
import { sql } from 'drizzle-orm';
import { bigint, check, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { projects } from './projects';

/** `{ column: { before?, after? } }`, or `{ column: { changed: true } }` for a large value that is not copied. */
export type HistoryChanges = Record<string, { before?: unknown; after?: unknown; changed?: true }>;

export const historyEvents = pgTable(
  'history_events',
  {
    id: uuid().primaryKey().defaultRandom(),
    /** Order of recording: newest first is `at` then `seq`, descending (entries of one transaction share `at`). */
    seq: bigint({ mode: 'number' }).notNull().generatedAlwaysAsIdentity(),
    /** A project's history goes with the project. */
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    /** The time of the transaction that made the change. */
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** Null when the change was made without a person (a script, the seed) or the person was removed since. */
    actorId: uuid().references(() => users.id, { onDelete: 'set null' }),
    /** The person's name and e-mail as they were at the time of the change. */
    actorName: text(),
    actorEmail: text(),
    /** What kind of thing changed: `structure`, `mode`, `load-case`, `sign-off`, … (the trigger's first argument). */
    entity: text().notNull(),
    entityId: uuid().notNull(),
    /** The thing's name as it was after the change (before it, for a delete); a sign-off's is its variant's. */
    label: text(),
    /** `create`, `update`, `delete`; for a sign-off the state it entered: `submitted`, `approved`, `returned`. */
    action: text().notNull(),
    changes: jsonb().$type<HistoryChanges>().notNull(),
    /** The transaction that made the change: a variant and its load-case list changed together make one entry. */
    transactionId: bigint({ mode: 'number' }).notNull().default(sql`txid_current()`),
  },
  (table) => [
    index('history_events_project_at_idx').on(table.projectId, table.at.desc(), table.seq.desc()),
    index('history_events_transaction_entity_idx').on(table.transactionId, table.entityId),
    check('history_events_changes_is_object', sql`jsonb_typeof(${table.changes}) = 'object'`),
  ],
);
