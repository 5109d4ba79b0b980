import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { invitations, memberships, organisations, users } from '../../db/schema';
import type { Role } from '../../../shared/contracts/roles';
import { bumpSessionGeneration } from '../users/users.repository';

export type InvitationRow = typeof invitations.$inferSelect;
export interface MemberRow {
  userId: string;
  email: string;
  name: string | null;
  role: Role;
  joinedAt: Date;
}

const memberColumns = { userId: users.id, email: users.email, name: users.name, role: memberships.role, joinedAt: memberships.createdAt };

/** One page of the organisation's members by e-mail; `limit` rows from `offset`. */
export function listMembers(db: Database, organisationId: string, page: { offset: number; limit: number }): Promise<MemberRow[]> {
  return db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.organisationId, organisationId))
    .orderBy(users.email)
    .limit(page.limit)
    .offset(page.offset);
}

export async function findMember(db: Database, organisationId: string, userId: string): Promise<MemberRow | undefined> {
  const [row] = await db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)))
    .limit(1);
  return row;
}

/** The organisation's member with this e-mail address, if any. */
export async function findMemberByEmail(db: Database, organisationId: string, email: string): Promise<MemberRow | undefined> {
  const [row] = await db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), eq(users.email, email.trim().toLowerCase())))
    .limit(1);
  return row;
}

type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];

/**
 * Locks the organisation's admin rows and the member's row (in that order, so two changes queue up), and returns
 * how many admins there are and the member's current role (undefined when not a member).
 */
async function lockAdminsAndMember(tx: Transaction, organisationId: string, userId: string): Promise<{ adminCount: number; current: { role: Role } | undefined }> {
  const admins = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.role, 'admin')))
    .for('update');
  const [current] = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)))
    .for('update');
  return { adminCount: admins.length, current };
}

/**
 * Sets a member's role. Refuses (returns 'last_admin') to take the admin role from the organisation's last admin;
 * the admins' rows are locked so two simultaneous changes cannot both pass that check.
 */
export function updateMemberRole(db: Database, organisationId: string, userId: string, role: Role): Promise<'updated' | 'not_found' | 'last_admin'> {
  return db.transaction(async (tx) => {
    const { adminCount, current } = await lockAdminsAndMember(tx, organisationId, userId);
    if (!current) return 'not_found';
    if (current.role === 'admin' && role !== 'admin' && adminCount <= 1) return 'last_admin';
    if (current.role === role) return 'updated';
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)));
    // A new role ends the person's sessions: they sign in again and get a token with it.
    await bumpSessionGeneration(tx, userId);
    return 'updated';
  });
}

export async function insertOrganisation(db: Database, name: string): Promise<string> {
  const [row] = await db.insert(organisations).values({ name }).returning({ id: organisations.id });
  return row.id;
}

/**
 * Removes a person from the organisation: their account goes with their membership (a person belongs to one
 * organisation), so the address can be invited again. Refuses to remove the last admin.
 */
export function removeMember(db: Database, organisationId: string, userId: string): Promise<'removed' | 'not_found' | 'last_admin'> {
  return db.transaction(async (tx) => {
    const { adminCount, current } = await lockAdminsAndMember(tx, organisationId, userId);
    if (!current) return 'not_found';
    if (current.role === 'admin' && adminCount <= 1) return 'last_admin';
    await tx.delete(users).where(eq(users.id, userId));
    return 'removed';
  });
}

/** Withdraws an invitation that has not been used. */
export async function withdrawInvitation(db: Database, organisationId: string, id: string): Promise<'withdrawn' | 'not_found' | 'used'> {
  const [row] = await db
    .select({ acceptedAt: invitations.acceptedAt })
    .from(invitations)
    .where(and(eq(invitations.organisationId, organisationId), eq(invitations.id, id)));
  if (!row) return 'not_found';
  if (row.acceptedAt) return 'used';
  await db.delete(invitations).where(and(eq(invitations.organisationId, organisationId), eq(invitations.id, id)));
  return 'withdrawn';
}

/** One page of the organisation's invitations, newest first; `limit` rows from `offset`. */
export function listInvitations(db: Database, organisationId: string, page: { offset: number; limit: number }): Promise<InvitationRow[]> {
  return db
    .select()
    .from(invitations)
    .where(eq(invitations.organisationId, organisationId))
    .orderBy(desc(invitations.createdAt), invitations.id)
    .limit(page.limit)
    .offset(page.offset);
}

/** Stores a new invitation, replacing any invitation to the same address that is still open. */
export function replaceInvitation(
  db: Database,
  values: { organisationId: string; email: string; name: string | null; role: Role; tokenHash: string; invitedBy: string | null; expiresAt: Date },
): Promise<InvitationRow> {
  return db.transaction(async (tx) => {
    await tx
      .delete(invitations)
      .where(and(eq(invitations.organisationId, values.organisationId), eq(invitations.email, values.email), isNull(invitations.acceptedAt)));
    const [row] = await tx.insert(invitations).values(values).returning();
    return row;
  });
}

export async function deleteInvitation(db: Database, id: string): Promise<void> {
  await db.delete(invitations).where(eq(invitations.id, id));
}

export async function findInvitationByTokenHash(db: Database, tokenHash: string): Promise<(InvitationRow & { organisationName: string }) | undefined> {
  const [row] = await db
    .select({ invitation: invitations, organisationName: organisations.name })
    .from(invitations)
    .innerJoin(organisations, eq(organisations.id, invitations.organisationId))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  return row ? { ...row.invitation, organisationName: row.organisationName } : undefined;
}

export type AcceptOutcome =
  | { outcome: 'accepted'; userId: string; email: string; role: Role; organisationName: string }
  | { outcome: 'not_found' | 'used' | 'expired' | 'email_taken' };

/** Creates the invited person with the invitation's role and marks the invitation used, all or nothing. */
export function acceptInvitation(db: Database, tokenHash: string, input: { name: string; passwordHash: string }): Promise<AcceptOutcome> {
  return db.transaction(async (tx) => {
    const [invitation] = await tx.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).for('update');
    if (!invitation) return { outcome: 'not_found' as const };
    if (invitation.acceptedAt) return { outcome: 'used' as const };
    if (invitation.expiresAt.getTime() <= Date.now()) return { outcome: 'expired' as const };
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, invitation.email)).limit(1);
    if (taken) return { outcome: 'email_taken' as const };
    const [user] = await tx
      .insert(users)
      .values({ email: invitation.email, name: input.name, passwordHash: input.passwordHash, emailVerified: sql`now()` })
      .returning({ id: users.id });
    await tx.insert(memberships).values({ organisationId: invitation.organisationId, userId: user.id, role: invitation.role });
    await tx.update(invitations).set({ acceptedAt: sql`now()` }).where(eq(invitations.id, invitation.id));
    const [organisation] = await tx.select({ name: organisations.name }).from(organisations).where(eq(organisations.id, invitation.organisationId));
    return { outcome: 'accepted' as const, userId: user.id, email: invitation.email, role: invitation.role, organisationName: organisation.name };
  });
}
