import { infiniteQueryOptions } from '@tanstack/react-query';
import { historyListSchema, type HistoryFilters } from '../../../../shared/contracts/history';
import { apiRequest } from '../../../lib/api-client';

export const historyPageSize = 30;

/** Under the project's key, so every change that refreshes the project refreshes its history too. */
export const historyKeys = {
  all: (projectId: string) => ['projects', projectId, 'history'] as const,
  filtered: (projectId: string, filters: HistoryFilters) => [...historyKeys.all(projectId), filters] as const,
};

function historyPath(projectId: string, filters: HistoryFilters, page: number): string {
  const query = new URLSearchParams({ page: String(page), pageSize: String(historyPageSize) });
  for (const [key, value] of Object.entries(filters)) if (value !== undefined && value !== '') query.set(key, String(value));
  return `/api/projects/${encodeURIComponent(projectId)}/history?${query.toString()}`;
}

/** The project's history, newest first, one page at a time ("older" fetches the next). */
export const historyQueryOptions = (projectId: string, filters: HistoryFilters) =>
  infiniteQueryOptions({
    queryKey: historyKeys.filtered(projectId, filters),
    // Changes come from every page of the project, whose own mutations refresh only their own keys: always ask again.
    staleTime: 0,
    queryFn: ({ pageParam, signal }) => apiRequest(historyPath(projectId, filters, pageParam), { schema: historyListSchema, signal }),
    initialPageParam: 1,
    getNextPageParam: (last) => (last.paging.hasMore ? last.paging.page + 1 : undefined),
  });
