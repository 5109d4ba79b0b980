import { MutationObserver, QueryClient, QueryObserver } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import type { Me } from '../../../../shared/contracts';
import { appConfigQueryOptions, meQueryOptions, signOutMutationOptions } from './session';

const me = { id: 'u1', name: 'Demo Person (invented)' } as unknown as Me;
const config = { mode: 'test' as const, demoAccounts: [], demoPassword: null, devMailbox: false };
const structuresKey = ['projects', 'p1', 'structures'];

/** A cache as a signed-in page leaves it: the person, the configuration, and a page's request still on its way. */
function signedInCache() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  client.setQueryData(meQueryOptions().queryKey, me);
  client.setQueryData(appConfigQueryOptions().queryKey, config);
  const aborted: { value: boolean } = { value: false };
  const observer = new QueryObserver(client, {
    queryKey: structuresKey,
    queryFn: ({ signal }) =>
      new Promise((_resolve, reject) => {
        signal.addEventListener('abort', () => {
          aborted.value = true;
          reject(new DOMException('aborted', 'AbortError'));
        });
      }),
  });
  const unsubscribe = observer.subscribe(() => undefined);
  return { client, aborted, unsubscribe };
}

describe('signing out', () => {
  it('forgets the person and aborts requests in flight before the server ends the session, then starts the cache over', async () => {
    const { client, aborted, unsubscribe } = signedInCache();
    const seenWhenEnding: { me: unknown; aborted: boolean; fetching: number }[] = [];
    const endSession = async () => {
      seenWhenEnding.push({ me: client.getQueryData(meQueryOptions().queryKey), aborted: aborted.value, fetching: client.isFetching() });
    };
    await new MutationObserver(client, signOutMutationOptions(client, endSession)).mutate();
    expect(seenWhenEnding).toEqual([{ me: null, aborted: true, fetching: 0 }]);
    expect(client.getQueryData(meQueryOptions().queryKey)).toBeNull();
    expect(client.getQueryData(structuresKey)).toBeUndefined();
    expect(client.getQueryData(appConfigQueryOptions().queryKey)).toEqual(config);
    unsubscribe();
  });

  it('puts the person back when the server refuses', async () => {
    const { client, unsubscribe } = signedInCache();
    const endSession = async () => {
      throw new Error('offline');
    };
    await expect(new MutationObserver(client, signOutMutationOptions(client, endSession)).mutate()).rejects.toThrow('offline');
    expect(client.getQueryData(meQueryOptions().queryKey)).toEqual(me);
    unsubscribe();
  });
});
