import { useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { historyQuerySchema, type HistoryFilters } from '../../../shared/contracts/history';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageTitle } from '../../components/ui/page-title';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { historyQueryOptions } from '../../features/history/api/history';
import { HistoryFiltersForm, type PersonChoice } from '../../features/history/components/history-filters';
import { HistoryList } from '../../features/history/components/history-list';
import { projectMembersQueryOptions } from '../../features/projects/api/projects';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

const filterKeys = ['entity', 'entityId', 'action', 'by', 'from', 'to'] as const;

/** The filters in the address (so a filtered history can be shared); one that does not parse is left out. */
function filtersFrom(search: URLSearchParams): HistoryFilters {
  const filters: Record<string, string> = {};
  for (const key of filterKeys) {
    const value = search.get(key);
    if (value && historyQuerySchema.safeParse({ [key]: value }).success) filters[key] = value;
  }
  return filters as HistoryFilters;
}

export async function projectHistoryLoader({ params, request }: LoaderFunctionArgs) {
  const filters = filtersFrom(new URL(request.url).searchParams);
  await queryClient.ensureInfiniteQueryData(historyQueryOptions(params.projectId ?? '', filters)).catch(() => undefined);
  return null;
}

/** Every change of the project's things: who made it, when, and the values before and after. */
export function ProjectHistoryRoute() {
  const { project } = useProjectContext();
  const [search, setSearch] = useSearchParams();
  const filters = filtersFrom(search);
  const history = useInfiniteQuery(historyQueryOptions(project.id, filters));
  const members = useQuery(projectMembersQueryOptions(project.id));

  const people = new Map<string, string>();
  for (const member of members.data ?? []) people.set(member.userId, member.name);
  for (const page of history.data?.pages ?? []) for (const event of page.events) if (event.by?.id && !people.has(event.by.id)) people.set(event.by.id, event.by.name || event.by.email || 'A former member');
  const choices: PersonChoice[] = [...people].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));

  const events = history.data?.pages.flatMap((page) => page.events) ?? [];
  const names = Object.assign({}, ...(history.data?.pages.map((page) => page.names) ?? [])) as Record<string, string>;
  const filtered = filterKeys.some((key) => filters[key] !== undefined);

  return (
    <div className="flex flex-col gap-6">
      <PageTitle title={`History · ${project.name}`} />
      <Panel title="History" description="Every change of the project’s structures, modes, lumped models, load cases, comfort criteria, tuning variants, sign-offs, site records and as-built records: who made it, when, and the values before and after, newest first. Values are shown as stored, in SI units.">
        <HistoryFiltersForm
          key={search.toString()}
          filters={filters}
          people={choices}
          onChange={(next) => {
            const params = new URLSearchParams();
            for (const key of filterKeys) if (next[key]) params.set(key, next[key] as string);
            setSearch(params);
          }}
        />
      </Panel>
      <Panel title={filtered ? 'Changes that match' : 'Changes'}>
        {history.isPending ? (
          <Loading label="Loading the history…" />
        ) : history.isError ? (
          <QueryError error={history.error} retry={() => void history.refetch()} what="the history" />
        ) : events.length === 0 ? (
          <p className="text-small text-ink-muted">{filtered ? 'No change matches these filters.' : 'Nothing has changed in this project yet.'}</p>
        ) : (
          <div className="flex flex-col gap-4">
            <HistoryList events={events} names={names} />
            {history.hasNextPage ? (
              <div>
                <Button tone="secondary" busy={history.isFetchingNextPage} onClick={() => void history.fetchNextPage()}>
                  Older changes
                </Button>
              </div>
            ) : (
              <p className="text-caption text-ink-muted">That is the earliest change{filtered ? ' that matches' : ''}.</p>
            )}
          </div>
        )}
      </Panel>
    </div>
  );
}
