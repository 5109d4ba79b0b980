import type { PageQuery, Paging } from '../../shared/contracts/paging';

/** Cuts rows fetched with `limit: pageSize + 1` to the page and says whether more follow. */
export function paged<T>(rows: T[], query: PageQuery): { items: T[]; paging: Paging } {
  return { items: rows.slice(0, query.pageSize), paging: { page: query.page, pageSize: query.pageSize, hasMore: rows.length > query.pageSize } };
}
