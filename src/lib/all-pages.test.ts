import { describe, expect, it, vi } from 'vitest';
import { maxPageSize, pageQuerySchema, type PageQuery } from '../../shared/contracts/paging';
import { fetchAllPages, pageSearch } from './all-pages';

/** A server's paging as server/lib/paging.ts does it: one row more than the page tells whether more follow. */
function pagedServer(rows: number[]) {
  return vi.fn(async ({ page, pageSize }: PageQuery) => {
    const slice = rows.slice((page - 1) * pageSize, (page - 1) * pageSize + pageSize + 1);
    return { items: slice.slice(0, pageSize), paging: { page, pageSize, hasMore: slice.length > pageSize } };
  });
}

describe('fetchAllPages', () => {
  it('reads every page in order until the server says no more follow', async () => {
    const rows = Array.from({ length: 7 }, (_, index) => index + 1);
    const server = pagedServer(rows);
    const answers = await fetchAllPages(server, { pageSize: 3 });
    expect(answers.flatMap((answer) => answer.items)).toEqual(rows);
    expect(server.mock.calls.map(([query]) => query)).toEqual([
      { page: 1, pageSize: 3 },
      { page: 2, pageSize: 3 },
      { page: 3, pageSize: 3 },
    ]);
  });

  it('asks once when the list fits one page, also when it is exactly full or empty', async () => {
    for (const length of [0, 2, 3]) {
      const server = pagedServer(Array.from({ length }, (_, index) => index));
      const answers = await fetchAllPages(server, { pageSize: 3 });
      expect(answers.flatMap((answer) => answer.items)).toHaveLength(length);
      expect(server).toHaveBeenCalledTimes(1);
    }
  });

  it('uses the largest page size the API accepts by default', async () => {
    const server = pagedServer([1]);
    await fetchAllPages(server);
    expect(server).toHaveBeenCalledWith({ page: 1, pageSize: maxPageSize });
    expect(pageQuerySchema.safeParse({ page: '1', pageSize: String(maxPageSize) }).success).toBe(true);
  });

  it('refuses a list that never ends rather than asking forever', async () => {
    const endless = vi.fn(async ({ page, pageSize }: PageQuery) => ({ paging: { page, pageSize, hasMore: true } }));
    await expect(fetchAllPages(endless, { maxPages: 4 })).rejects.toThrow('past 4 pages');
    expect(endless).toHaveBeenCalledTimes(4);
  });

  it('stops at the first failure and passes it on', async () => {
    const failing = vi.fn(async ({ page, pageSize }: PageQuery) => {
      if (page === 2) throw new Error('offline');
      return { paging: { page, pageSize, hasMore: true } };
    });
    await expect(fetchAllPages(failing)).rejects.toThrow('offline');
    expect(failing).toHaveBeenCalledTimes(2);
  });
});

describe('pageSearch', () => {
  it('writes the query the server validates', () => {
    const search = pageSearch({ page: 2, pageSize: 200 });
    expect(search).toBe('?page=2&pageSize=200');
    expect(pageQuerySchema.parse(Object.fromEntries(new URLSearchParams(search)))).toEqual({ page: 2, pageSize: 200 });
  });
});
