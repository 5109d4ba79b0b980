/**
 * Site records: a measured acceleration record of a structure. The uploaded file is kept as it came (bytea), so
 * that its analysis can be run again with another band or method; the latest analysis (the identify answer) is jsonb.
 */
import { sql } from 'drizzle-orm';
import { check, customType, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { IdentifyResponse } from '../../../shared/contracts/identify';
import { siteRecordConditions } from '../../../shared/contracts/site-records';
import { users } from './auth';
import { projects } from './projects';
import { structureModes, structures } from './structural-model';

const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => 'bytea',
});

export const siteRecordConditionEnum = pgEnum('site_record_condition', siteRecordConditions);

export const siteRecords = pgTable(
  'site_records',
  {
    id: uuid().primaryKey().defaultRandom(),
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    structureId: uuid()
      .notNull()
      .references(() => structures.id, { onDelete: 'cascade' }),
    modeId: uuid().references(() => structureModes.id, { onDelete: 'set null' }),
    condition: siteRecordConditionEnum().notNull(),
    fileName: text().notNull(),
    fileBytes: bytea().notNull(),
    /** The chosen acceleration column (header) and its 0-based index among the acceleration columns. */
    channel: text().notNull(),
    channelIndex: integer().notNull(),
    channels: jsonb().$type<string[]>().notNull(),
    /** Given with a single-column file; null when the file has a time column. */
    givenSampleRateHz: doublePrecision(),
    sampleRateHz: doublePrecision().notNull(),
    sampleCount: integer().notNull(),
    measuredAt: timestamp({ withTimezone: true }),
    notes: text(),
    analysis: jsonb().$type<IdentifyResponse>().notNull(),
    version: integer().notNull().default(1),
    createdBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('site_records_project_idx').on(table.projectId),
    index('site_records_structure_idx').on(table.structureId),
    check('site_records_version_positive', sql`${table.version} >= 1`),
    check('site_records_sample_rate_positive', sql`${table.sampleRateHz} > 0`),
  ],
);
