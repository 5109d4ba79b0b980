import { DrizzleAdapter } from '@auth/drizzle-adapter';
import type { JWT } from '@auth/core/jwt';
import type { ExpressAuthConfig } from '@auth/express';
import Credentials from '@auth/express/providers/credentials';
import { z } from 'zod';
import type { Database } from '../db/client';
import { accounts, authenticators, sessions, users, verificationTokens } from '../db/schema';
import { isDatabaseUnavailable, reportDatabaseOutage } from '../db/availability';
import { bumpSessionGeneration, findUserByEmail, findUserById, upgradePasswordHash } from '../modules/users/users.repository';
import { roleSchema } from '../../shared/contracts/roles';
import { hashPassword, passwordNeedsRehash, verifyPassword } from './password';

/** How long a sign-in lasts without activity; the JWT is renewed at most once an hour while it is used. */
export const sessionMaxAgeS = 12 * 60 * 60;

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().min(3).max(320),
  password: z.string().min(1).max(200),
});

/** Auth.js errors caused by the request, not by the server: answered, not logged. */
const expectedAuthErrors = new Set(['CredentialsSignin', 'JWTSessionError', 'MissingCSRF', 'UnknownAction']);

/** The token's own claims beside `sub` (the user id). */
const claimsSchema = z.object({ organisationId: z.string(), role: roleSchema });
/** The person's session generation at sign-in (docs/decisions/0017-session-generation.md). */
const generationSchema = z.object({ sessionGeneration: z.number().int() });
/** The same generation as the token carries it. */
const generationClaimSchema = z.object({ generation: z.number().int() });

/**
 * Whether a token Auth.js has decrypted still stands: 'ended' when its person is gone, has no membership, or has
 * another session generation (sign-out, password or role change; docs/decisions/0017-session-generation.md), or when
 * it carries no generation (issued before generations existed, which the API refuses as well). 'unchecked' when the
 * database cannot be reached: an outage must not end a session by mistake, so the token stands until the database
 * is back (the API itself answers 503 meanwhile, compute aside).
 */
async function sessionState(db: Database, token: JWT): Promise<'current' | 'ended' | 'unchecked'> {
  const generation = generationClaimSchema.safeParse(token);
  if (typeof token.sub !== 'string' || !generation.success) return 'ended';
  try {
    const person = await findUserById(db, token.sub);
    return person && person.sessionGeneration === generation.data.generation ? 'current' : 'ended';
  } catch (error) {
    if (!isDatabaseUnavailable(error)) {
      // Auth.js files a throw here as an unreadable cookie (JWTSessionError, which the logger keeps quiet): say it.
      process.stderr.write(`[auth] could not check the session: ${error instanceof Error ? error.message : String(error)}\n`);
      throw error;
    }
    reportDatabaseOutage(error);
    return 'unchecked';
  }
}

export function createAuthConfig(options: { db: Database; secret: string }): ExpressAuthConfig {
  const { db } = options;
  return {
    secret: options.secret,
    trustHost: true,
    basePath: '/api/auth',
    // Credentials sign-in only works with JWT sessions; the adapter still owns the users table (docs/decisions).
    session: { strategy: 'jwt', maxAge: sessionMaxAgeS, updateAge: 60 * 60 },
    adapter: DrizzleAdapter(db, {
      usersTable: users,
      accountsTable: accounts,
      sessionsTable: sessions,
      verificationTokensTable: verificationTokens,
      authenticatorsTable: authenticators,
    }),
    providers: [
      Credentials({
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        async authorize(raw) {
          const parsed = credentialsSchema.safeParse(raw);
          if (!parsed.success) return null;
          const user = await findUserByEmail(db, parsed.data.email);
          const ok = await verifyPassword(parsed.data.password, user?.passwordHash);
          if (!user || !ok) return null;
          // A hash from an earlier version (bcrypt) is replaced by an scrypt hash now that the password is known.
          if (user.passwordHash && passwordNeedsRehash(user.passwordHash)) {
            await upgradePasswordHash(db, user.id, user.passwordHash, await hashPassword(parsed.data.password));
          }
          return {
            id: user.id,
            email: user.email,
            name: user.name,
            organisationId: user.organisationId,
            role: user.role,
            sessionGeneration: user.sessionGeneration,
          };
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          // Sign-in: the person was just read with their password, so the generation is current.
          const claims = claimsSchema.parse(user);
          token.sub = user.id;
          token.organisationId = claims.organisationId;
          token.role = claims.role;
          token.generation = generationSchema.parse(user).sessionGeneration;
          return token;
        }
        // Every later use of the cookie by Auth.js itself (GET /api/auth/session) checks it the way requireUser does,
        // so that Auth.js never shows as signed in a session the API has ended (docs/decisions/0017). Returning null
        // makes Auth.js answer "no session" and clear the cookie. One primary-key read per call of the endpoint.
        const state = await sessionState(db, token);
        return state === 'ended' ? null : token;
      },
      session({ session, token }) {
        // The role and organisation in the session are those at sign-in; the API reads the current ones per request.
        const claims = claimsSchema.safeParse(token);
        Object.assign(session.user, {
          id: token.sub,
          organisationId: claims.success ? claims.data.organisationId : null,
          role: claims.success ? claims.data.role : null,
        });
        return session;
      },
    },
    events: {
      // Signing out ends every session of the person, including copies of this cookie kept elsewhere.
      async signOut(message) {
        const sub = 'token' in message ? message.token?.sub : undefined;
        if (typeof sub === 'string') await bumpSessionGeneration(db, sub);
      },
    },
    logger: {
      error(error) {
        // A wrong password, or a stale or forged session cookie, is an answer (401), not a server fault.
        const type = (error as { type?: string }).type;
        if (type && expectedAuthErrors.has(type)) return;
        process.stderr.write(`[auth] ${error.name}: ${error.message}\n`);
      },
      warn(code) {
        process.stderr.write(`[auth] warning: ${code}\n`);
      },
      debug() {},
    },
  };
}
