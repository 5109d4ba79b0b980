import type { Database } from '../../db/client';
import type { CurrentUser } from '../../middleware/auth';
import type { HistoryChange, HistoryEvent, HistoryList, HistoryQuery } from '../../../shared/contracts/history';
import { pageOffset } from '../../../shared/contracts/paging';
import { paged } from '../../lib/paging';
import { requireProject } from '../projects/projects.service';
import * as repository from './history.repository';

/** `deck_area_m2` → `deckAreaM2`: the triggers record column names, the API speaks its field names. */
export function fieldName(column: string): string {
  return column.replace(/_([a-z0-9])/g, (_, c: string) => c.toUpperCase());
}

/** Columns whose values are ids of other things of the project: their names travel with the page. */
const referenceColumns = new Set(['structure_id', 'mode_id', 'criteria_id', 'variant_id', 'load_case_ids', 'lumped_model_id']);
const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function referencedIds(rows: readonly repository.HistoryEventRow[]): string[] {
  const ids = new Set<string>();
  for (const row of rows) {
    for (const [column, change] of Object.entries(row.changes)) {
      if (!referenceColumns.has(column)) continue;
      for (const value of [change.before, change.after].flat()) if (typeof value === 'string' && uuidPattern.test(value)) ids.add(value);
    }
  }
  return [...ids];
}

export function toHistoryEvent(row: repository.HistoryEventRow): HistoryEvent {
  const changes: Record<string, HistoryChange> = {};
  for (const [column, change] of Object.entries(row.changes)) changes[fieldName(column)] = change;
  return {
    id: row.id,
    at: row.at.toISOString(),
    by: row.actorId || row.actorName || row.actorEmail ? { id: row.actorId, name: row.actorName, email: row.actorEmail } : null,
    entity: row.entity,
    entityId: row.entityId,
    label: row.label,
    action: row.action,
    changes,
  };
}

/** Every role of the project's organisation reads its history (docs/decisions/0004); another organisation's is 404. */
export async function listHistory(db: Database, user: CurrentUser, projectId: string, query: HistoryQuery): Promise<HistoryList> {
  await requireProject(db, user, projectId);
  const rows = await repository.listHistoryEvents(db, projectId, query, { offset: pageOffset(query), limit: query.pageSize + 1 });
  const { items, paging } = paged(rows, query);
  const names = await repository.namesOf(db, projectId, referencedIds(items));
  return { events: items.map(toHistoryEvent), paging, names: Object.fromEntries(names) };
}
