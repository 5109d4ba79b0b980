import { and, desc, eq, gte, lt, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../../db/executor';
import { historyEvents } from '../../db/schema';
import type { HistoryQuery } from '../../../shared/contracts/history';

export type HistoryEventRow = typeof historyEvents.$inferSelect;

/** One page of the project's history, newest first (`limit` rows from `offset`), with the query's filters. */
export function listHistoryEvents(db: Executor, projectId: string, query: HistoryQuery, page: { offset: number; limit: number }): Promise<HistoryEventRow[]> {
  const conditions: SQL[] = [eq(historyEvents.projectId, projectId)];
  if (query.entity) conditions.push(eq(historyEvents.entity, query.entity));
  if (query.entityId) conditions.push(eq(historyEvents.entityId, query.entityId));
  if (query.action) conditions.push(eq(historyEvents.action, query.action));
  if (query.by) conditions.push(eq(historyEvents.actorId, query.by));
  if (query.from) conditions.push(gte(historyEvents.at, new Date(query.from)));
  if (query.to) conditions.push(lt(historyEvents.at, new Date(query.to)));
  return db
    .select()
    .from(historyEvents)
    .where(and(...conditions))
    .orderBy(desc(historyEvents.at), desc(historyEvents.seq))
    .limit(page.limit)
    .offset(page.offset);
}

/** Names of the project's things with these ids that still exist (structures, modes, load cases, criteria, variants). */
export async function namesOf(db: Executor, projectId: string, ids: readonly string[]): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const list = sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `);
  const result = await db.execute<{ id: string; name: string }>(sql`
    select id, name from structures where project_id = ${projectId} and id in (${list})
    union all select m.id, m.label from structure_modes m join structures s on s.id = m.structure_id where s.project_id = ${projectId} and m.id in (${list})
    union all select id, name from load_cases where project_id = ${projectId} and id in (${list})
    union all select id, name from comfort_criteria where project_id = ${projectId} and id in (${list})
    union all select id, name from tuning_variants where project_id = ${projectId} and id in (${list})
    union all select id, name from lumped_models where structure_id in (select id from structures where project_id = ${projectId}) and id in (${list})`);
  return new Map(result.rows.map((row) => [row.id, row.name]));
}
