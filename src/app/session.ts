import { useQuery, type QueryClient } from '@tanstack/react-query';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import type { Me } from '../../shared/contracts';
import { appConfigQueryOptions, meQueryOptions } from '../features/auth/api/session';
import { queryClient } from '../lib/query-client';

/** Root loader: the server's mode and who is signed in, before the first paint. */
export async function rootLoader() {
  await Promise.all([queryClient.ensureQueryData(appConfigQueryOptions()), queryClient.ensureQueryData(meQueryOptions())]);
  return null;
}

/** Loader of the signed-in part: sends a visitor without a session to the sign-in page, coming back afterwards. */
export async function requireSessionLoader({ request }: LoaderFunctionArgs) {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (!me) {
    const url = new URL(request.url);
    throw redirect(signInPath(url.pathname + url.search));
  }
  return null;
}

type Loader = (args: LoaderFunctionArgs) => unknown;

/**
 * The one rule for the loaders of signed-in pages: they prefetch only for a signed-in person. A deep link opened
 * signed out (a mailed link) runs the child loaders beside `requireSessionLoader`, which sends the visitor to the
 * sign-in page; without this rule they would fetch first and be answered 401. The session check shares the one
 * request in flight for the session key, so signed in it costs nothing more.
 */
export function whenSignedIn<L extends Loader>(loader: L, client: QueryClient = queryClient) {
  return async (args: LoaderFunctionArgs): Promise<Awaited<ReturnType<L>> | null> => {
    if (!(await client.ensureQueryData(meQueryOptions()))) return null;
    return (await loader(args)) as Awaited<ReturnType<L>>;
  };
}

/** The sign-in page, which returns to `next` (a path and its query) afterwards. */
export function signInPath(next: string): string {
  return next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
}

/** The signed-in person; only for pages below the signed-in layout, which guarantees the session. */
export function useCurrentUser(): Me {
  const { data } = useQuery(meQueryOptions());
  if (!data) throw new Error('No signed-in person: this page belongs below the signed-in layout.');
  return data;
}

/** A path inside this site to return to after signing in, or the projects list. */
export function safeNextPath(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/projects';
}
