import { getSession, type ExpressAuthConfig } from '@auth/express';
import type { Request, RequestHandler } from 'express';
import type { Database } from '../db/client';
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

/**
 * 401 unless the request carries a valid session of a person who still belongs to an organisation. The session and
 * the person are read once per request: a request that already passed (another mount) goes straight on.
 */
export function requireUser(db: Database, authConfig: ExpressAuthConfig): RequestHandler {
  return async (req, _res, next) => {
    if (currentUsers.has(req)) {
      next();
      return;
    }
    const session = await getSession(req, authConfig).catch(() => null);
    const userId = (session?.user as { id?: unknown } | undefined)?.id;
    if (typeof userId !== 'string') throw new HttpError(401, 'unauthenticated', 'Sign in first');
    const user = await findUserById(db, userId);
    if (!user) throw new HttpError(401, 'unauthenticated', 'Your account is no longer active; sign in again');
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
