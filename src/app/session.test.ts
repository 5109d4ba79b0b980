import { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { describe, expect, it, vi } from 'vitest';
import type { Me } from '../../shared/contracts';
import { meQueryOptions } from '../features/auth/api/session';
import { safeNextPath, signInPath, whenSignedIn } from './session';

const args = { params: { projectId: 'p1' }, request: new Request('http://localhost/projects/p1/structures') } as unknown as LoaderFunctionArgs;

function clientWith(me: Me | null): QueryClient {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  client.setQueryData(meQueryOptions().queryKey, me);
  return client;
}

describe('whenSignedIn', () => {
  it('does not run the loader when nobody is signed in', async () => {
    const loader = vi.fn(async () => 'prefetched');
    await expect(whenSignedIn(loader, clientWith(null))(args)).resolves.toBeNull();
    expect(loader).not.toHaveBeenCalled();
  });

  it('runs the loader with its arguments for a signed-in person and passes its answer on', async () => {
    const loader = vi.fn(async (received: LoaderFunctionArgs) => received.params.projectId);
    const me = { id: 'u1', name: 'Demo Person' } as unknown as Me;
    await expect(whenSignedIn(loader, clientWith(me))(args)).resolves.toBe('p1');
    expect(loader).toHaveBeenCalledWith(args);
  });
});

describe('the way back after signing in', () => {
  it('keeps the deep link with its query and refuses paths off the site', () => {
    const next = '/projects/p1/structures?tab=modes';
    expect(signInPath(next)).toBe(`/sign-in?next=${encodeURIComponent(next)}`);
    expect(safeNextPath(new URLSearchParams(signInPath(next).split('?')[1]).get('next'))).toBe(next);
    expect(safeNextPath('//elsewhere.example/x')).toBe('/projects');
    expect(safeNextPath(null)).toBe('/projects');
  });
});
