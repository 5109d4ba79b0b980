import { and, eq, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { memberships, organisations, users } from '../../db/schema';
import type { Role } from '../../../shared/contracts/roles';

export interface UserWithMembership {
  id: string;
  email: string;
  name: string | null;
  passwordHash: string | null;
  sessionGeneration: number;
  role: Role;
  organisationId: string;
  organisationName: string;
}

const columns = {
  id: users.id,
  email: users.email,
  name: users.name,
  passwordHash: users.passwordHash,
  sessionGeneration: users.sessionGeneration,
  role: memberships.role,
  organisationId: organisations.id,
  organisationName: organisations.name,
};

function withMembership(db: Database) {
  return db
    .select(columns)
    .from(users)
    .innerJoin(memberships, eq(memberships.userId, users.id))
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId));
}

/** Prepared once per database handle: this read runs on every signed-in request (requireUser). */
const userByIdStatements = new WeakMap<Database, ReturnType<typeof prepareUserById>>();
function prepareUserById(db: Database) {
  return withMembership(db).where(eq(users.id, sql.placeholder('id'))).limit(1).prepare('user_with_membership_by_id');
}

export async function findUserById(db: Database, id: string): Promise<UserWithMembership | undefined> {
  let statement = userByIdStatements.get(db);
  if (!statement) {
    statement = prepareUserById(db);
    userByIdStatements.set(db, statement);
  }
  const [row] = await statement.execute({ id });
  return row;
}

export async function findUserByEmail(db: Database, email: string): Promise<UserWithMembership | undefined> {
  const [row] = await withMembership(db).where(eq(users.email, email.trim().toLowerCase())).limit(1);
  return row;
}

export async function emailRegistered(db: Database, email: string): Promise<boolean> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email.trim().toLowerCase())).limit(1);
  return row !== undefined;
}

/** Ends every session of the person (their tokens carry the old generation); returns the new generation. */
export async function bumpSessionGeneration(db: Pick<Database, 'update'>, userId: string): Promise<number | undefined> {
  const [row] = await db
    .update(users)
    .set({ sessionGeneration: sql`${users.sessionGeneration} + 1` })
    .where(eq(users.id, userId))
    .returning({ sessionGeneration: users.sessionGeneration });
  return row?.sessionGeneration;
}

/** Replaces a password hash by a new one of the same password (a stronger scheme), unless it changed meanwhile. */
export async function upgradePasswordHash(db: Database, userId: string, oldHash: string, newHash: string): Promise<void> {
  await db
    .update(users)
    .set({ passwordHash: newHash })
    .where(and(eq(users.id, userId), eq(users.passwordHash, oldHash)));
}

/** Sets a new password and ends every session of the person in one statement; returns the new generation. */
export async function setPasswordEndingSessions(db: Database, userId: string, passwordHash: string): Promise<number | undefined> {
  const [row] = await db
    .update(users)
    .set({ passwordHash, sessionGeneration: sql`${users.sessionGeneration} + 1` })
    .where(eq(users.id, userId))
    .returning({ sessionGeneration: users.sessionGeneration });
  return row?.sessionGeneration;
}
