/**
 * As-built records of an approved damper: what the fabricator measured on each unit (moving mass, and when known
 * spring rate and tuned frequency), kept as recorded. A re-measurement is a new row; earlier rows stay
 * (docs/decisions/0021-as-built-records.md). The comparison with the hardware sheet is computed when read.
 */
import { sql } from 'drizzle-orm';
import { check, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { AsBuiltUnit } from '../../../shared/contracts/as-built';
import { users } from './auth';
import { projects } from './projects';
import { signOffs } from './sign-offs';

export const asBuiltRecords = pgTable(
  'as_built_records',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    /** An approved sign-off is never deleted (the freeze keeps its variant and project), so neither is its record. */
    signOffId: uuid()
      .notNull()
      .references(() => signOffs.id, { onDelete: 'cascade' }),
    /** The measured units, each once, numbered 1..the sheet's unit count (checked by the shared contract). */
    units: jsonb().$type<AsBuiltUnit[]>().notNull(),
    note: text(),
    recordedBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    recordedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('as_built_records_sign_off_idx').on(table.signOffId, table.recordedAt),
    index('as_built_records_project_idx').on(table.projectId),
    check('as_built_records_units_listed', sql`jsonb_typeof(${table.units}) = 'array' and jsonb_array_length(${table.units}) >= 1`),
  ],
);
