/**
 * The browser side of the Auth.js Credentials flow on /api/auth: fetch a CSRF token (which also sets its cookie),
 * post the form, and read the JSON `{ url }` answer that the `X-Auth-Return-Redirect` header asks for.
 */
import { z } from 'zod';
import { apiErrorSchema } from '../../shared/contracts';
import { ApiError, networkError } from './api-client';

/** Query key of the signed-in person (null when signed out); a 401 anywhere clears it, which leads to sign-in. */
export const sessionQueryKey = ['me'] as const;

const csrfSchema = z.object({ csrfToken: z.string().min(1) });
const redirectSchema = z.object({ url: z.string() });

async function fetchCsrfToken(): Promise<string> {
  let response: Response;
  try {
    response = await fetch('/api/auth/csrf', { credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw networkError();
  }
  const parsed = csrfSchema.safeParse(await response.json().catch(() => null));
  if (!response.ok || !parsed.success) {
    throw new ApiError(response.status, 'auth_unavailable', 'Sign-in is not available right now. Try again in a moment.');
  }
  return parsed.data.csrfToken;
}

async function postAuthForm(path: string, fields: Record<string, string>): Promise<string> {
  let response: Response;
  try {
    response = await fetch(path, {
      method: 'POST',
      credentials: 'same-origin',
      headers: {
        'Content-Type': 'application/x-www-form-urlencoded',
        Accept: 'application/json',
        'X-Auth-Return-Redirect': '1',
      },
      body: new URLSearchParams(fields).toString(),
    });
  } catch {
    throw networkError();
  }
  const payload: unknown = await response.json().catch(() => null);
  const parsed = redirectSchema.safeParse(payload);
  if (!parsed.success) {
    // The server's own refusals (too many attempts from here, database unavailable) carry a message for people.
    const refusal = apiErrorSchema.safeParse(payload);
    if (refusal.success) throw new ApiError(response.status, refusal.data.error.code, refusal.data.error.message, refusal.data.error.issues);
    throw new ApiError(response.status, 'auth_failed', `The sign-in service answered ${response.status}.`);
  }
  return parsed.data.url;
}

/** Signs in with e-mail and password; throws an ApiError (status 401, code `invalid_credentials`) when refused. */
export async function signInWithCredentials(email: string, password: string): Promise<void> {
  const csrfToken = await fetchCsrfToken();
  const url = await postAuthForm('/api/auth/callback/credentials', { csrfToken, email, password });
  if (/[?&]error=/.test(url)) {
    throw new ApiError(401, 'invalid_credentials', 'That e-mail and password do not match an account. Check both and try again.');
  }
}

/** Ends the session (clears the session cookie). */
export async function signOut(): Promise<void> {
  const csrfToken = await fetchCsrfToken();
  await postAuthForm('/api/auth/signout', { csrfToken });
}
