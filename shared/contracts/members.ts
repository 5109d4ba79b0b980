import { z } from 'zod';
import { pagingSchema } from './paging';
import { roleSchema } from './roles';

/** A typed name: trimmed, 1–120 characters, no NUL character (no text column can store one). */
const personName = () =>
  z
    .string()
    .trim()
    .min(1, 'is required')
    .max(120, 'must be at most 120 characters')
    .refine((value) => !value.includes('\u0000'), 'must not contain a NUL character (\\u0000)');

/** RFC 5321 §4.5.3.1.3: a path holds at most 256 octets including its angle brackets, so an address at most 254. */
export const maxEmailLength = 254;

export const memberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  status: z.enum(['pending', 'accepted', 'expired']),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** GET /api/organisation/members?page&pageSize: one page of the members and one of the invitations (newest first). */
export const memberListSchema = z.object({
  members: z.array(memberSchema),
  invitations: z.array(invitationSchema),
  paging: pagingSchema,
});
export type MemberList = z.infer<typeof memberListSchema>;

/** GET /api/organisation/people (every member): who is in the organisation, e.g. to pick a project's team. */
export const peopleListSchema = z.object({ people: z.array(memberSchema), paging: pagingSchema });
export type PeopleList = z.infer<typeof peopleListSchema>;

/** Body of POST /api/organisation/members (and POST /api/organisation/invitations): invite a person by e-mail. */
export const createInvitationSchema = z.strictObject({
  email: z
    .string()
    .trim()
    .toLowerCase()
    .max(maxEmailLength, `must be at most ${maxEmailLength} characters`)
    .pipe(z.email('must be an e-mail address')),
  name: personName().optional(),
  role: roleSchema,
});
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;

/** Body of POST /api/invitations/:token/accept (public: the token is the proof). */
export const acceptInvitationSchema = z.strictObject({
  name: personName(),
  password: z.string().min(10, 'must be at least 10 characters').max(200),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const invitationPreviewSchema = z.object({
  email: z.string(),
  role: roleSchema,
  organisationName: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** Answer of POST /api/invitations/:token/accept: the account now exists; the client signs in with it. */
export const acceptedInvitationSchema = z.object({
  userId: z.string(),
  email: z.string(),
  role: roleSchema,
  organisationName: z.string(),
});
export type AcceptedInvitation = z.infer<typeof acceptedInvitationSchema>;

/** PATCH /api/organisation/members/:userId (admin only). */
export const updateMemberRoleSchema = z.strictObject({ role: roleSchema });
export type UpdateMemberRoleInput = z.infer<typeof updateMemberRoleSchema>;

export const userIdParamsSchema = z.object({ userId: z.uuid('must be a user id (UUID)') });
export const invitationIdParamsSchema = z.object({ id: z.uuid('must be an invitation id (UUID)') });
export const invitationTokenParamsSchema = z.object({ token: z.string().min(20, 'must be an invitation token') });

/** The people working on one project (GET/POST /api/projects/:id/members). Their role is their organisation role. */
export const projectMemberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  addedAt: z.string(),
});
export type ProjectMember = z.infer<typeof projectMemberSchema>;
export const projectMemberListSchema = z.object({ members: z.array(projectMemberSchema), paging: pagingSchema });
export const addProjectMemberSchema = z.strictObject({ userId: z.uuid('must be a user id (UUID)') });
export type AddProjectMemberInput = z.infer<typeof addProjectMemberSchema>;
