import { z } from 'zod';

/**
 * Paging of every list that can grow (projects, members, invitations, people, a project's members):
 * `?page=1&pageSize=50`, pages counted from 1. The answer keeps its list field and adds `paging`.
 */
export const defaultPageSize = 50;
export const maxPageSize = 200;

const wholeNumber = (what: string) =>
  z.coerce.number({ error: `must be a ${what}` }).refine(Number.isFinite, `must be a ${what}`).pipe(z.number().int(`must be a whole number`));

export const pageQuerySchema = z.object({
  page: wholeNumber('page number').pipe(z.number().min(1, 'must be 1 or more').max(1_000_000, 'must be at most 1000000')).default(1),
  pageSize: wholeNumber('page size')
    .pipe(z.number().min(1, 'must be 1 or more').max(maxPageSize, `must be at most ${maxPageSize}`))
    .default(defaultPageSize),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export const pagingSchema = z.object({
  page: z.number().int(),
  pageSize: z.number().int(),
  /** True when the next page holds more. */
  hasMore: z.boolean(),
});
export type Paging = z.infer<typeof pagingSchema>;

/** Rows to skip for a page. */
export function pageOffset(query: PageQuery): number {
  return (query.page - 1) * query.pageSize;
}
