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

/** The verified claims of the request's session cookie, or null (none, forged, expired, or from an older version). */
export async function readSessionClaims(req: Request, secret: string): Promise<SessionClaims | null> {
  for (const name of [sessionCookieNames.secure, sessionCookieNames.plain]) {
    const token = readCookie(req, name);
    if (!token) continue;
    const payload = await decode({ token, secret, salt: name }).catch(() => null);
    const claims = sessionClaimsSchema.safeParse(payload);
    return claims.success ? claims.data : null;
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
