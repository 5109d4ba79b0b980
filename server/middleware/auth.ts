import type { ExpressAuthConfig } from '@auth/express';
import type { Request, RequestHandler } from 'express';
import { readSessionClaims } from '../auth/session-token';
import type { Database } from '../db/client';
import { isDatabaseUnavailable, reportDatabaseOutage } from '../db/availability';
import { HttpError } from '../lib/http-error';
import { findUserById } from '../modules/users/users.repository';
import type { Role } from '../../shared/contracts/roles';

/** The signed-in person as the database has them now (role changes take effect on the next request). */
export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  organisationId: string;
  organisationName: string;
}

const currentUsers = new WeakMap<Request, CurrentUser>();

/** The user that requireUser attached; throws when a route forgot requireUser. */
export function currentUser(req: Request): CurrentUser {
  const user = currentUsers.get(req);
  if (!user) throw new HttpError(401, 'unauthenticated', 'Sign in first');
  return user;
}

export interface RequireUserOptions {
  /**
   * 'refuse' (default): when the database cannot be reached, 503 database_unavailable.
   * 'token': for routes that use no stored data (compute), the verified session token stands in for the database
   * read: its role and organisation are those at sign-in, and a session ended by sign-out or a password change is
   * not noticed until the database is back (docs/decisions/0017-session-generation.md).
   */
  whenDatabaseDown?: 'refuse' | 'token';
}

/**
 * 401 unless the request carries a valid session of a person who still belongs to an organisation and whose session
 * generation still matches the one in the token (sign-out, a password change, a role change or removal end every
 * session). The session and the person are read once per request: a request that already passed goes straight on.
 */
export function requireUser(db: Database, authConfig: ExpressAuthConfig, options: RequireUserOptions = {}): RequestHandler {
  const secret = String(authConfig.secret);
  return async (req, _res, next) => {
    if (currentUsers.has(req)) {
      next();
      return;
    }
    const claims = await readSessionClaims(req, secret);
    if (!claims) throw new HttpError(401, 'unauthenticated', 'Sign in first');
    let user: Awaited<ReturnType<typeof findUserById>>;
    try {
      user = await findUserById(db, claims.sub);
    } catch (error) {
      if (options.whenDatabaseDown === 'token' && isDatabaseUnavailable(error)) {
        reportDatabaseOutage(error);
        currentUsers.set(req, {
          id: claims.sub,
          email: claims.email ?? '',
          name: claims.name ?? claims.email ?? '',
          role: claims.role,
          organisationId: claims.organisationId,
          organisationName: '',
        });
        next();
        return;
      }
      throw error;
    }
    if (!user) throw new HttpError(401, 'unauthenticated', 'Your account is no longer active; sign in again');
    if (user.sessionGeneration !== claims.generation) throw new HttpError(401, 'session_ended', 'This session has ended (signed out, password or role changed); sign in again');
    currentUsers.set(req, {
      id: user.id,
      email: user.email,
      name: user.name ?? user.email,
      role: user.role,
      organisationId: user.organisationId,
      organisationName: user.organisationName,
    });
    next();
  };
}

/** 403 unless the signed-in person's organisation role is one of `allowed`. Use after requireUser. */
export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    const user = currentUser(req);
    if (!allowed.includes(user.role)) {
      throw new HttpError(403, 'forbidden', `This needs the role ${allowed.join(' or ')}; you are ${user.role}`);
    }
    next();
  };
}
