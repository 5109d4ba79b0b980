import { sql } from 'drizzle-orm';
import { check, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { projectKinds } from '../../../shared/contracts/projects';
import { users } from './auth';
import { organisations } from './organisations';

export const projectKindEnum = pgEnum('project_kind', projectKinds);

export const projects = pgTable(
  'projects',
  {
    id: uuid().primaryKey().defaultRandom(),
    organisationId: uuid()
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    kind: projectKindEnum().notNull(),
    location: text(),
    description: text(),
    /** Optimistic concurrency: every change must name the version it read; it then goes up by one. */
    version: integer().notNull().default(1),
    createdBy: uuid().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('projects_organisation_idx').on(table.organisationId),
    check('projects_name_not_blank', sql`length(trim(${table.name})) > 0`),
    check('projects_version_positive', sql`${table.version} >= 1`),
  ],
);

/** The people working on a project. What they may do follows from their organisation role. */
export const projectMembers = pgTable(
  'project_members',
  {
    projectId: uuid()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    addedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.projectId, table.userId] })],
);
