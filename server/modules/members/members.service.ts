import { createHash, randomBytes } from 'node:crypto';
import type { Database } from '../../db/client';
import type { Env } from '../../env';
import { hashPassword } from '../../auth/password';
import { HttpError, notFound } from '../../lib/http-error';
import type { Mailer } from '../../mail/mailer';
import { invitationMail } from '../../mail/templates';
import type { CurrentUser } from '../../middleware/auth';
import type {
  AcceptInvitationInput,
  AcceptedInvitation,
  CreateInvitationInput,
  Invitation,
  InvitationPreview,
  Member,
  MemberList,
  PeopleList,
} from '../../../shared/contracts/members';
import { pageOffset, type PageQuery } from '../../../shared/contracts/paging';
import type { Role } from '../../../shared/contracts/roles';
import { paged } from '../../lib/paging';
import { emailRegistered } from '../users/users.repository';
import * as repository from './members.repository';

/** How long an invitation link works. */
export const invitationLifetimeMs = 7 * 24 * 60 * 60 * 1000;

export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

const invitationNotFound = () => notFound('The invitation', 'invitation_not_found');
const invitationUsed = () => new HttpError(410, 'invitation_used', 'This invitation has already been used: sign in instead');
const invitationExpired = () => new HttpError(410, 'invitation_expired', 'This invitation has expired: ask your admin for a new one');

function toMember(row: repository.MemberRow): Member {
  return { userId: row.userId, email: row.email, name: row.name ?? row.email, role: row.role, joinedAt: row.joinedAt.toISOString() };
}

function invitationStatus(row: repository.InvitationRow, now = Date.now()): Invitation['status'] {
  if (row.acceptedAt) return 'accepted';
  return row.expiresAt.getTime() <= now ? 'expired' : 'pending';
}

function toInvitation(row: repository.InvitationRow): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status: invitationStatus(row),
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
  };
}

/** One page of the members and the same page of the invitations; `hasMore` when either list goes on. */
export async function listMembers(db: Database, user: CurrentUser, query: PageQuery): Promise<MemberList> {
  const page = { offset: pageOffset(query), limit: query.pageSize + 1 };
  const [memberRows, invitationRows] = await Promise.all([repository.listMembers(db, user.organisationId, page), repository.listInvitations(db, user.organisationId, page)]);
  const members = paged(memberRows, query);
  const invitations = paged(invitationRows, query);
  return {
    members: members.items.map(toMember),
    invitations: invitations.items.map(toInvitation),
    paging: { ...members.paging, hasMore: members.paging.hasMore || invitations.paging.hasMore },
  };
}

/** The organisation's people without the invitations: readable by every member. */
export async function listPeople(db: Database, user: CurrentUser, query: PageQuery): Promise<PeopleList> {
  const { items, paging } = paged(await repository.listMembers(db, user.organisationId, { offset: pageOffset(query), limit: query.pageSize + 1 }), query);
  return { people: items.map(toMember), paging };
}

export async function changeMemberRole(db: Database, user: CurrentUser, userId: string, role: Role): Promise<Member> {
  const outcome = await repository.updateMemberRole(db, user.organisationId, userId, role);
  if (outcome === 'not_found') throw notFound('The member', 'member_not_found');
  if (outcome === 'last_admin') {
    throw new HttpError(409, 'last_admin', 'The organisation needs at least one admin: make someone else admin first', [
      { path: 'role', message: 'role: the last admin cannot be given another role' },
    ]);
  }
  const member = await repository.findMember(db, user.organisationId, userId);
  if (!member) throw notFound('The member', 'member_not_found');
  return toMember(member);
}

export async function removeMember(db: Database, user: CurrentUser, userId: string): Promise<void> {
  if (userId === user.id) {
    throw new HttpError(409, 'cannot_remove_self', 'You cannot remove yourself: ask another admin', [
      { path: 'userId', message: 'userId: is your own account' },
    ]);
  }
  const outcome = await repository.removeMember(db, user.organisationId, userId);
  if (outcome === 'not_found') throw notFound('The member', 'member_not_found');
  if (outcome === 'last_admin') throw new HttpError(409, 'last_admin', 'The organisation needs at least one admin');
}

export async function withdrawInvitation(db: Database, user: CurrentUser, id: string): Promise<void> {
  const outcome = await repository.withdrawInvitation(db, user.organisationId, id);
  if (outcome === 'not_found') throw invitationNotFound();
  if (outcome === 'used') throw new HttpError(409, 'invitation_used', 'This invitation has been accepted already; remove the member instead');
}

/** Who an invitation comes from. */
interface InvitationSource {
  organisationId: string;
  organisationName: string;
  inviterName: string;
  invitedBy: string | null;
}

/**
 * Stores an invitation and mails its link. When the mail cannot be sent and `mailRequired`, the invitation is
 * withdrawn again (502); otherwise it is kept and the caller hands the link on itself.
 */
async function issueInvitation(
  deps: { db: Database; mailer: Mailer; env: Env },
  source: InvitationSource,
  input: CreateInvitationInput,
  mailRequired: boolean,
): Promise<{ invitation: Invitation; link: string; mailError: string | null }> {
  // Someone already in this organisation is refused (the admin sees the members anyway). An address with an account
  // in another organisation is answered exactly like a new one, so that an invitation reveals nothing about other
  // organisations: the invitation is stored and mailed, and accepting it is refused (the person signs in instead).
  if (await repository.findMemberByEmail(deps.db, source.organisationId, input.email)) {
    throw new HttpError(409, 'already_member', `${input.email} is already a member of your organisation`, [
      { path: 'email', message: 'email: is already a member of your organisation' },
    ]);
  }
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + invitationLifetimeMs);
  const row = await repository.replaceInvitation(deps.db, {
    organisationId: source.organisationId,
    email: input.email,
    name: input.name ?? null,
    role: input.role,
    tokenHash: hashInvitationToken(token),
    invitedBy: source.invitedBy,
    expiresAt,
  });
  const link = `${deps.env.appUrl}/invitations/${token}`;
  let mailError: string | null = null;
  try {
    await deps.mailer.send(
      invitationMail({ to: input.email, link, organisationName: source.organisationName, inviterName: source.inviterName, role: input.role, expiresAt }),
    );
  } catch (error) {
    mailError = (error as Error).message;
    if (mailRequired) {
      await repository.deleteInvitation(deps.db, row.id);
      throw new HttpError(502, 'mail_failed', `The invitation mail could not be sent (${mailError}); nothing was stored, try again`);
    }
  }
  return { invitation: toInvitation(row), link, mailError };
}

/** An admin invites a person into their organisation by e-mail. */
export async function invite(deps: { db: Database; mailer: Mailer; env: Env }, user: CurrentUser, input: CreateInvitationInput): Promise<Invitation> {
  const source = { organisationId: user.organisationId, organisationName: user.organisationName, inviterName: user.name, invitedBy: user.id };
  return (await issueInvitation(deps, source, input, true)).invitation;
}

/**
 * A new organisation with an invitation for its first admin (the way in on a production database, where no demo
 * is seeded). The link is returned as well as mailed, so that it can be handed over when no mail relay is set up.
 */
export async function createOrganisationWithAdmin(
  deps: { db: Database; mailer: Mailer; env: Env },
  input: { organisationName: string; adminEmail: string; adminName?: string },
): Promise<{ organisationId: string; invitation: Invitation; link: string; mailError: string | null }> {
  const adminEmail = input.adminEmail.trim().toLowerCase();
  if (await emailRegistered(deps.db, adminEmail)) {
    throw new HttpError(409, 'already_registered', `${input.adminEmail} already has a Stillspan account`, [
      { path: 'adminEmail', message: 'adminEmail: already has an account' },
    ]);
  }
  const organisationId = await repository.insertOrganisation(deps.db, input.organisationName);
  const source = { organisationId, organisationName: input.organisationName, inviterName: 'Stillspan', invitedBy: null };
  const result = await issueInvitation(deps, source, { email: adminEmail, name: input.adminName, role: 'admin' }, false);
  return { organisationId, ...result };
}

async function openInvitation(db: Database, token: string) {
  const row = await repository.findInvitationByTokenHash(db, hashInvitationToken(token));
  if (!row) throw invitationNotFound();
  if (row.acceptedAt) throw invitationUsed();
  if (row.expiresAt.getTime() <= Date.now()) throw invitationExpired();
  return row;
}

export async function previewInvitation(db: Database, token: string): Promise<InvitationPreview> {
  const row = await openInvitation(db, token);
  return { email: row.email, role: row.role, organisationName: row.organisationName };
}

/**
 * Checks the link before the password is hashed (a dead link costs no bcrypt round), then accepts it in one
 * transaction that checks again under a row lock, since another acceptance may come in between.
 */
export async function acceptInvitation(db: Database, token: string, input: AcceptInvitationInput): Promise<AcceptedInvitation> {
  await openInvitation(db, token);
  const result = await repository.acceptInvitation(db, hashInvitationToken(token), { name: input.name, passwordHash: await hashPassword(input.password) });
  switch (result.outcome) {
    case 'accepted':
      return { userId: result.userId, email: result.email, role: result.role, organisationName: result.organisationName };
    case 'not_found':
      throw invitationNotFound();
    case 'used':
      throw invitationUsed();
    case 'expired':
      throw invitationExpired();
    case 'email_taken':
      throw new HttpError(409, 'already_registered', 'This e-mail address already has an account: sign in instead');
  }
}
