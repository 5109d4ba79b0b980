import { maxPageSize, type PageQuery, type Paging } from '../../shared/contracts/paging';

/** Pages read for one list at most: 500 pages of 200 rows, far more than any team; past it the list is refused. */
export const maxPagesRead = 500;

/** `?page=2&pageSize=200` for a paged list (shared/contracts/paging.ts). */
export function pageSearch({ page, pageSize }: PageQuery): string {
  return `?${new URLSearchParams({ page: String(page), pageSize: String(pageSize) }).toString()}`;
}

/**
 * Reads a paged list to its end: page 1, 2, … at the largest page size the API allows, until an answer says
 * `hasMore: false`. Pages are read one after another, each from where the one before ended. Returns the answers in
 * order; the caller joins their list fields.
 */
export async function fetchAllPages<Answer extends { paging: Paging }>(
  fetchPage: (query: PageQuery) => Promise<Answer>,
  { pageSize = maxPageSize, maxPages = maxPagesRead }: { pageSize?: number; maxPages?: number } = {},
): Promise<Answer[]> {
  const answers: Answer[] = [];
  for (let page = 1; ; page += 1) {
    if (page > maxPages) throw new Error(`The list goes on past ${maxPages} pages of ${pageSize}; it is not read further.`);
    const answer = await fetchPage({ page, pageSize });
    answers.push(answer);
    if (!answer.paging.hasMore) return answers;
  }
}
