import { QueryClient } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Invitation, Member } from '../../../../shared/contracts';
import { organisationMembersQueryOptions, organisationPeopleQueryOptions } from './members';

// An invented organisation larger than one page of 200: 230 people and 205 open invitations.
const members: Member[] = Array.from({ length: 230 }, (_, index) => ({
  userId: `u${index}`,
  email: `person${index}@example.test`,
  name: `Person ${index}`,
  role: 'viewer',
  joinedAt: '2026-01-01T00:00:00.000Z',
}));
const invitations: Invitation[] = Array.from({ length: 205 }, (_, index) => ({
  id: `i${index}`,
  email: `invited${index}@example.test`,
  role: 'engineer',
  status: 'pending',
  createdAt: '2026-01-01T00:00:00.000Z',
  expiresAt: '2026-01-08T00:00:00.000Z',
}));

/** The API's paging (server/lib/paging.ts): `page`/`pageSize`, `hasMore` when either list goes on. */
function slice<T>(rows: T[], url: URL): { items: T[]; hasMore: boolean; page: number; pageSize: number } {
  const page = Number(url.searchParams.get('page') ?? 1);
  const pageSize = Number(url.searchParams.get('pageSize') ?? 50);
  const from = (page - 1) * pageSize;
  return { items: rows.slice(from, from + pageSize), hasMore: rows.length > from + pageSize, page, pageSize };
}

const requested: string[] = [];
function serve() {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (path: string) => {
      const url = new URL(path, 'http://localhost');
      requested.push(`${url.pathname}${url.search}`);
      const people = slice(members, url);
      const open = slice(invitations, url);
      const paging = { page: people.page, pageSize: people.pageSize, hasMore: people.hasMore || open.hasMore };
      const body =
        url.pathname === '/api/organisation/people'
          ? { people: people.items, paging: { ...paging, hasMore: people.hasMore } }
          : { members: people.items, invitations: open.items, paging };
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    }),
  );
}

afterEach(() => {
  vi.unstubAllGlobals();
  requested.length = 0;
});

describe('the organisation lists read every page', () => {
  it('members and invitations: both lists whole, in the order of the pages', async () => {
    serve();
    const list = await new QueryClient().fetchQuery(organisationMembersQueryOptions());
    expect(list.members.map((m) => m.userId)).toEqual(members.map((m) => m.userId));
    expect(list.invitations.map((i) => i.id)).toEqual(invitations.map((i) => i.id));
    expect(requested).toEqual(['/api/organisation/members?page=1&pageSize=200', '/api/organisation/members?page=2&pageSize=200']);
  });

  it('people: the whole list for picking a project team', async () => {
    serve();
    const people = await new QueryClient().fetchQuery(organisationPeopleQueryOptions());
    expect(people).toHaveLength(230);
    expect(requested).toEqual(['/api/organisation/people?page=1&pageSize=200', '/api/organisation/people?page=2&pageSize=200']);
  });
});
