import { createHash } from 'node:crypto';
import express, { type Request, type RequestHandler } from 'express';
import type pg from 'pg';
import { errorBody } from '../middleware/error-handler';

export interface SignInThrottleOptions {
  /** Sign-in attempts allowed for one e-mail address from one client address within the window. */
  maxPerAddressAndClient?: number;
  /** Sign-in attempts allowed from one client address within the window, whatever the e-mail address. */
  maxPerClient?: number;
  windowS?: number;
}

export const signInThrottleDefaults = { maxPerAddressAndClient: 10, maxPerClient: 100, windowS: 15 * 60 } as const;

/** The key a count is kept under: a SHA-256, so that no e-mail or client address is stored in clear. */
function counterKey(kind: 'pair' | 'client', value: string): string {
  return createHash('sha256').update(`${kind}:${value}`).digest('base64url');
}

/**
 * Counts one attempt for each key atomically (one statement, so several server processes and simultaneous requests
 * share the count: 30 simultaneous guesses cannot all read "9"), starting a new window for a key whose window has
 * passed. Returns each key's count and the seconds left in its window, in the order given.
 */
async function countAttempts(pool: pg.Pool, keys: string[], windowS: number): Promise<{ count: number; retryAfterS: number }[]> {
  const values = keys.map((_, i) => `($${i + 2}, 1, now())`).join(', ');
  const result = await pool.query<{ key: string; count: number; retry_after_s: number }>(
    `INSERT INTO sign_in_attempts AS a (key, count, window_started_at) VALUES ${values}
     ON CONFLICT (key) DO UPDATE SET
       count = CASE WHEN a.window_started_at <= now() - make_interval(secs => $1) THEN 1 ELSE a.count + 1 END,
       window_started_at = CASE WHEN a.window_started_at <= now() - make_interval(secs => $1) THEN now() ELSE a.window_started_at END
     RETURNING key, count, ceil(extract(epoch FROM a.window_started_at + make_interval(secs => $1) - now()))::int AS retry_after_s`,
    [windowS, ...keys],
  );
  const byKey = new Map(result.rows.map((row) => [row.key, { count: row.count, retryAfterS: Math.max(1, row.retry_after_s) }]));
  return keys.map((key) => byKey.get(key) ?? { count: 0, retryAfterS: 1 });
}

/** A successful sign-in: the pair's count starts over and the client's attempt is given back. */
async function clearAfterSuccess(pool: pg.Pool, pairKey: string, clientKey: string): Promise<void> {
  await pool.query('WITH cleared AS (DELETE FROM sign_in_attempts WHERE key = $1) UPDATE sign_in_attempts SET count = greatest(count - 1, 0) WHERE key = $2', [
    pairKey,
    clientKey,
  ]);
}

/** Now and then, rows whose window has long passed are removed. */
async function pruneOld(pool: pg.Pool, windowS: number): Promise<void> {
  await pool.query(`DELETE FROM sign_in_attempts WHERE window_started_at < now() - make_interval(secs => $1)`, [windowS * 2]);
}

function signedIn(res: express.Response): boolean {
  const cookies = ([] as unknown[]).concat(res.getHeader('set-cookie') ?? []).map(String);
  return cookies.some((cookie) => /session-token=[^;]+/.test(cookie));
}

/** The client address as Express sees it (X-Forwarded-For only from a trusted proxy: TRUST_PROXY). */
function clientAddress(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}

/**
 * Slows password guessing down in front of Auth.js (POST /api/auth/callback/credentials), with counts kept in
 * PostgreSQL so that every server process shares them:
 * - per e-mail address and client address: after `maxPerAddressAndClient` attempts within the window, that client
 *   gets 429 for that address until the window passes; the rightful owner signing in from elsewhere is not affected;
 * - per client address: after `maxPerClient` attempts within the window (a flood of addresses), that client gets 429.
 * Every attempt is counted before the password is checked, so simultaneous guesses cannot slip past the limit; a
 * successful sign-in clears its pair's count and gives the client's attempt back. See docs/decisions/0016-sign-in-throttle.md.
 */
export function signInThrottle(pool: pg.Pool, options: SignInThrottleOptions = {}): RequestHandler[] {
  const maxPair = options.maxPerAddressAndClient ?? signInThrottleDefaults.maxPerAddressAndClient;
  const maxClient = options.maxPerClient ?? signInThrottleDefaults.maxPerClient;
  const windowS = options.windowS ?? signInThrottleDefaults.windowS;

  const throttle: RequestHandler = async (req, res, next) => {
    if (req.method !== 'POST') {
      next();
      return;
    }
    const body = req.body as { email?: unknown } | undefined;
    const email = typeof body?.email === 'string' ? body.email.trim().toLowerCase().slice(0, 320) : '';
    const client = clientAddress(req);
    const pairKey = counterKey('pair', `${email}|${client}`);
    const clientKey = counterKey('client', client);
    const [pair, perClient] = await countAttempts(pool, [pairKey, clientKey], windowS);
    if (Math.random() < 0.01) pruneOld(pool, windowS).catch(() => undefined);
    const refused = pair.count > maxPair ? pair : perClient.count > maxClient ? perClient : null;
    if (refused) {
      const minutes = Math.ceil(refused.retryAfterS / 60);
      const wait = `try again in ${minutes} ${minutes === 1 ? 'minute' : 'minutes'}`;
      res
        .status(429)
        .set('Retry-After', String(refused.retryAfterS))
        .json(
          errorBody('too_many_sign_in_attempts', `Too many sign-in attempts from here; ${wait}. Signing in from another device or network still works.`, [
            { path: refused === pair ? 'email' : '', message: `${refused === pair ? 'email: ' : ''}too many sign-in attempts from here; ${wait}` },
          ]),
        );
      return;
    }
    // A successful sign-in (Auth.js sets the session cookie) clears the count before the answer goes out, so that
    // the next request of the person never races the clearing.
    const end = res.end.bind(res) as (...args: unknown[]) => express.Response;
    res.end = ((...args: unknown[]) => {
      if (!signedIn(res)) return end(...args);
      clearAfterSuccess(pool, pairKey, clientKey)
        .catch(() => undefined)
        .finally(() => end(...args));
      return res;
    }) as express.Response['end'];
    next();
  };
  // Auth.js reads the same parsed form body afterwards.
  return [express.urlencoded({ extended: false, limit: '16kb' }), express.json({ limit: '16kb' }), throttle];
}
