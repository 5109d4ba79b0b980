import { afterEach, describe, expect, it, vi } from 'vitest';
import { isApiError } from './api-client';
import { signInWithCredentials } from './auth';

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('signInWithCredentials', () => {
  it('shows the server’s own refusal, e.g. too many attempts from here', async () => {
    const message = 'Too many sign-in attempts from here; try again in 12 minutes. Signing in from another device or network still works.';
    const fetchMock = vi
      .fn()
      .mockResolvedValueOnce(json(200, { csrfToken: 'a'.repeat(64) }))
      .mockResolvedValueOnce(json(429, { error: { code: 'too_many_sign_in_attempts', message, issues: [{ path: 'email', message: 'email: too many sign-in attempts from here; try again in 12 minutes' }] } }));
    vi.stubGlobal('fetch', fetchMock);
    const error = await signInWithCredentials('someone@example.test', 'guess').catch((e: unknown) => e);
    expect(isApiError(error)).toBe(true);
    expect(error).toMatchObject({ status: 429, code: 'too_many_sign_in_attempts', message });
  });

  it('a wrong password is still invalid_credentials', async () => {
    vi.stubGlobal(
      'fetch',
      vi
        .fn()
        .mockResolvedValueOnce(json(200, { csrfToken: 'a'.repeat(64) }))
        .mockResolvedValueOnce(json(200, { url: 'http://x.test/sign-in?error=CredentialsSignin' })),
    );
    await expect(signInWithCredentials('someone@example.test', 'guess')).rejects.toMatchObject({ code: 'invalid_credentials' });
  });
});
