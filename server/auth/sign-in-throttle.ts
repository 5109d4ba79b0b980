import express, { type RequestHandler } from 'express';
import { errorBody } from '../middleware/error-handler';

export interface SignInThrottleOptions {
  /** Failed sign-ins for one e-mail address allowed within the window. */
  maxFailures?: number;
  windowMs?: number;
  now?: () => number;
}

/**
 * Slows down password guessing: after `maxFailures` failed sign-ins for one e-mail address within `windowMs`,
 * further attempts for it get 429 until the window has passed. A successful sign-in clears the count. Kept in
 * memory: a restart forgets it, and several server processes count separately.
 * Mounted in front of Auth.js on POST /api/auth/callback/credentials.
 */
export function signInThrottle(options: SignInThrottleOptions = {}): RequestHandler[] {
  const maxFailures = options.maxFailures ?? 10;
  const windowMs = options.windowMs ?? 15 * 60 * 1000;
  const now = options.now ?? Date.now;
  const failures = new Map<string, { count: number; firstAt: number }>();

  const prune = () => {
    const t = now();
    for (const [key, entry] of failures) if (t - entry.firstAt > windowMs) failures.delete(key);
  };

  const throttle: RequestHandler = (req, res, next) => {
    if (req.method !== 'POST') {
      next();
      return;
    }
    const body = req.body as { email?: unknown } | undefined;
    const email = typeof body?.email === 'string' ? body.email.trim().toLowerCase() : '';
    if (!email) {
      next();
      return;
    }
    if (failures.size > 10_000) prune();
    const entry = failures.get(email);
    if (entry && now() - entry.firstAt > windowMs) failures.delete(email);
    const current = failures.get(email);
    if (current && current.count >= maxFailures) {
      const retryAfterS = Math.max(1, Math.ceil((current.firstAt + windowMs - now()) / 1000));
      res
        .status(429)
        .set('Retry-After', String(retryAfterS))
        .json(
          errorBody('too_many_sign_in_attempts', `Too many failed sign-ins for ${email}: try again in ${Math.ceil(retryAfterS / 60)} minutes`, [
            { path: 'email', message: 'email: too many failed sign-ins, try again later' },
          ]),
        );
      return;
    }
    res.on('finish', () => {
      const cookies = ([] as unknown[]).concat(res.getHeader('set-cookie') ?? []).map(String);
      const signedIn = cookies.some((cookie) => /session-token=[^;]+/.test(cookie));
      if (signedIn) {
        failures.delete(email);
        return;
      }
      const existing = failures.get(email);
      if (existing) existing.count += 1;
      else failures.set(email, { count: 1, firstAt: now() });
    });
    next();
  };

  // Auth.js reads the same parsed form body afterwards.
  return [express.urlencoded({ extended: true }), express.json(), throttle];
}
