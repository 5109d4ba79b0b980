import { z } from 'zod';
import { projectParamsSchema } from './model';
import { pageQuerySchema, pagingSchema } from './paging';

/**
 * The project's history: every change of a project's things, who made it, when, and the values before and after
 * (docs/decisions/0020-history.md). Newest first, paged like every list that grows.
 */

/** The kinds of thing recorded so far (a table attached later records under its own name, shown as it is). */
export const historyEntities = ['structure', 'mode', 'lumped-model', 'load-case', 'comfort-criteria', 'tuning-variant', 'sign-off', 'site-record', 'as-built-record'] as const;
export type HistoryEntity = (typeof historyEntities)[number];

/** `create`, `update`, `delete`; a sign-off records the state it entered instead. */
export const historyActions = ['create', 'update', 'delete', 'submitted', 'approved', 'returned'] as const;
export type HistoryAction = (typeof historyActions)[number];

export const historyParamsSchema = projectParamsSchema;

const instant = (what: string) =>
  z.iso.datetime({ offset: true, error: `must be a date and time with its offset (ISO 8601, e.g. 2026-03-01T00:00:00Z): ${what}` });

export const historyQuerySchema = pageQuerySchema
  .extend({
    entity: z
      .string()
      .regex(/^[a-z][a-z-]{0,39}$/, `must be a kind of thing, one of ${historyEntities.join(', ')}`)
      .optional(),
    entityId: z.uuid('must be the id (UUID) of one thing').optional(),
    action: z.enum(historyActions, { error: `must be one of ${historyActions.join(', ')}` }).optional(),
    by: z.uuid('must be the id (UUID) of a person').optional(),
    from: instant('the earliest change listed').optional(),
    to: instant('changes before this time are listed').optional(),
  })
  .refine((q) => q.from === undefined || q.to === undefined || Date.parse(q.from) < Date.parse(q.to), {
    path: ['to'],
    message: 'must be later than from',
  });
export type HistoryQuery = z.output<typeof historyQuerySchema>;
/** The filters as the client sends them (paging filled in by the server when absent). */
export type HistoryFilters = Partial<Omit<HistoryQuery, 'page' | 'pageSize'>>;

/**
 * One field's change: `after` only when the thing was created, `before` only when it was deleted, both when it
 * changed; a large value (a stored file, an analysis, a sign-off's snapshot) is not copied: `{ changed: true }`.
 */
export const historyChangeSchema = z.object({
  before: z.unknown().optional(),
  after: z.unknown().optional(),
  changed: z.literal(true).optional(),
});
export type HistoryChange = z.infer<typeof historyChangeSchema>;

export const historyEventSchema = z.object({
  id: z.uuid(),
  at: z.string(),
  /** The person as they were named when they made the change; null when no person made it (a script, the seed). */
  by: z.object({ id: z.uuid().nullable(), name: z.string().nullable(), email: z.string().nullable() }).nullable(),
  entity: z.string(),
  entityId: z.uuid(),
  /** The thing's name when the change was made. */
  label: z.string().nullable(),
  action: z.string(),
  /** Keyed by the API's field names (`frequencyHz`, `loadCaseIds`, …). */
  changes: z.record(z.string(), historyChangeSchema),
});
export type HistoryEvent = z.infer<typeof historyEventSchema>;

export const historyListSchema = z.object({
  events: z.array(historyEventSchema),
  paging: pagingSchema,
  /** Names of the things that ids in the listed changes point at (modes, load cases, criteria, …), where they still exist. */
  names: z.record(z.string(), z.string()),
});
export type HistoryList = z.infer<typeof historyListSchema>;
