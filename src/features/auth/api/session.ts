import { z } from 'zod';
import { queryOptions, useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { appConfigSchema, meSchema, type Me } from '../../../../shared/contracts';
import { apiRequest, isApiError } from '../../../lib/api-client';
import { sessionQueryKey, signInWithCredentials, signOut } from '../../../lib/auth';

const authSessionSchema = z.object({ user: z.object({}).loose().optional() }).loose().nullable();

/**
 * Asks the server who is signed in: the person, or null when nobody is. Auth.js's session endpoint answers 200
 * either way, so a visitor without a session costs no failed request; /api/me then gives the current role and
 * organisation.
 */
export async function fetchSignedInPerson(signal?: AbortSignal): Promise<Me | null> {
  const session = await apiRequest('/api/auth/session', { schema: authSessionSchema, signal });
  if (!session?.user) return null;
  try {
    return await apiRequest('/api/me', { schema: meSchema, signal });
  } catch (error) {
    if (isApiError(error) && error.isUnauthenticated) return null;
    throw error;
  }
}

/** The signed-in person (null when signed out), cached under the session key. */
export const meQueryOptions = () =>
  queryOptions({
    queryKey: sessionQueryKey,
    queryFn: ({ signal }) => fetchSignedInPerson(signal),
    staleTime: 60_000,
  });

/** How the server runs (demo accounts, development mailbox); it does not change while the page is open. */
export const appConfigQueryOptions = () =>
  queryOptions({
    queryKey: ['config'],
    queryFn: ({ signal }) => apiRequest('/api/config', { schema: appConfigSchema, signal }),
    staleTime: Infinity,
  });

/**
 * After a sign-in, a sign-out or joining by invitation: everything cached belonged to nobody or to somebody else, so
 * the cache starts over holding only the server's configuration (which does not change) and the person now signed in
 * (as `fetchSignedInPerson` answered, read outside the cache so that no page re-renders with the old cache).
 */
export function resetCacheForPerson(queryClient: QueryClient, me: Me | null): void {
  const config = queryClient.getQueryData(appConfigQueryOptions().queryKey);
  queryClient.clear();
  queryClient.setQueryData(meQueryOptions().queryKey, me);
  if (config) queryClient.setQueryData(appConfigQueryOptions().queryKey, config);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ email, password }: { email: string; password: string }) => {
      await signInWithCredentials(email, password);
      return fetchSignedInPerson();
    },
    onSuccess: (me) => resetCacheForPerson(queryClient, me),
  });
}

/**
 * Signing out, in an order that lets no request leave once the session ends:
 * 1. stop a session check in flight, so that it cannot bring the person back;
 * 2. forget the person: the signed-in pages unmount (the signed-in layout sends them to the sign-in page), so none of
 *    their queries fetches or refetches any more;
 * 3. abort the requests still in flight;
 * 4. end the session on the server, then start the cache over.
 * If the server refuses, the person is put back and the signed-in layout returns them to the page they were on.
 */
export function signOutMutationOptions(queryClient: QueryClient, endSession: () => Promise<void> = signOut) {
  const sessionKey = meQueryOptions().queryKey;
  return {
    onMutate: async () => {
      await queryClient.cancelQueries({ queryKey: sessionKey, exact: true });
      const me = queryClient.getQueryData(sessionKey) ?? null;
      queryClient.setQueryData(sessionKey, null);
      await queryClient.cancelQueries();
      return { me };
    },
    mutationFn: endSession,
    onSuccess: () => resetCacheForPerson(queryClient, null),
    onError: (_error: unknown, _input: void, context: { me: Me | null } | undefined) => {
      if (context?.me) queryClient.setQueryData(sessionKey, context.me);
    },
  };
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation(signOutMutationOptions(queryClient));
}
