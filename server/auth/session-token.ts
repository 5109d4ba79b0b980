/**
 * Reading and re-issuing Auth.js's session cookie (an encrypted JWT) without going through Auth.js's request
 * handling: the API decodes it once per request with the same secret and salt Auth.js uses.
 */
import { decode, encode, type JWT } from '@auth/core/jwt';
import type { Request, Response } from 'express';
import { z } from 'zod';
import { roleSchema } from '../../shared/contracts/roles';

export const sessionCookieNames = { secure: '__Secure-authjs.session-token', plain: 'authjs.session-token' } as const;

/** The claims the API relies on; Auth.js adds name, email, iat, exp and jti. */
export const sessionClaimsSchema = z.object({
  sub: z.string(),
  organisationId: z.string(),
  role: roleSchema,
  generation: z.number().int(),
  email: z.string().nullish(),
  name: z.string().nullish(),
});
export type SessionClaims = z.infer<typeof sessionClaimsSchema>;

function readCookie(req: Request, name: string): string | undefined {
  const header = req.headers.cookie;
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) {
      try {
        return decodeURIComponent(part.slice(eq + 1).trim());
      } catch {
        return undefined;
      }
    }
  }
  return undefined;
}

/**
 * Tokens already decrypted, with their claims and expiry: decrypting costs about a millisecond of Web Crypto work per
 * request, while the same cookie comes back on every request of a page. Only a cache: what a token says never
 * changes, whether it is still honoured is decided by the session generation read from the database per request.
 * Bounded (oldest entries go first), per process, nothing another server process would need.
 */
const decodedTokens = new Map<string, { claims: SessionClaims; expiresAtMs: number }>();
const maxDecodedTokens = 10_000;

/** The verified claims of the request's session cookie, or null (none, forged, expired, or from an older version). */
export async function readSessionClaims(req: Request, secret: string): Promise<SessionClaims | null> {
  for (const name of [sessionCookieNames.secure, sessionCookieNames.plain]) {
    const token = readCookie(req, name);
    if (!token) continue;
    const cacheKey = `${secret}\u0000${name}=${token}`;
    const cached = decodedTokens.get(cacheKey);
    if (cached && cached.expiresAtMs > Date.now()) return cached.claims;
    const payload = await decode({ token, secret, salt: name }).catch(() => null);
    const claims = sessionClaimsSchema.safeParse(payload);
    if (!claims.success) return null;
    const exp = (payload as JWT).exp;
    if (typeof exp === 'number') {
      if (decodedTokens.size >= maxDecodedTokens) decodedTokens.delete(decodedTokens.keys().next().value as string);
      decodedTokens.set(cacheKey, { claims: claims.data, expiresAtMs: exp * 1000 });
    }
    return claims.data;
  }
  return null;
}

/**
 * Replaces the request's session cookie with one whose generation is `generation` (after a password change, the
 * device that made it stays signed in while every other session ends). Keeps the cookie's name, so its flags.
 */
export async function reissueSessionCookie(req: Request, res: Response, secret: string, generation: number, maxAgeS: number): Promise<void> {
  for (const name of [sessionCookieNames.secure, sessionCookieNames.plain]) {
    const token = readCookie(req, name);
    if (!token) continue;
    const payload = await decode({ token, secret, salt: name }).catch(() => null);
    if (!payload) return;
    const { iat: _iat, exp: _exp, jti: _jti, ...claims } = payload as JWT;
    const fresh = await encode({ token: { ...claims, generation }, secret, salt: name, maxAge: maxAgeS });
    res.cookie(name, fresh, { httpOnly: true, sameSite: 'lax', path: '/', secure: name === sessionCookieNames.secure, maxAge: maxAgeS * 1000 });
    return;
  }
}
