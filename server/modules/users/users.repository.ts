import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { memberships, organisations, users } from '../../db/schema';
import type { Role } from '../../../shared/contracts/roles';

export interface UserWithMembership {
  id: string;
  email: string;
  name: string | null;
  passwordHash: string | null;
  role: Role;
  organisationId: string;
  organisationName: string;
}

const columns = {
  id: users.id,
  email: users.email,
  name: users.name,
  passwordHash: users.passwordHash,
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

export async function findUserById(db: Database, id: string): Promise<UserWithMembership | undefined> {
  const [row] = await withMembership(db).where(eq(users.id, id)).limit(1);
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
