import { z } from 'zod';
import { roleSchema } from './roles';

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

export const memberListSchema = z.object({
  members: z.array(memberSchema),
  invitations: z.array(invitationSchema),
});
export type MemberList = z.infer<typeof memberListSchema>;

/** GET /api/organisation/people (every member): who is in the organisation, e.g. to pick a project's team. */
export const peopleListSchema = z.object({ people: z.array(memberSchema) });
export type PeopleList = z.infer<typeof peopleListSchema>;

/** Body of POST /api/organisation/members (and POST /api/organisation/invitations): invite a person by e-mail. */
export const createInvitationSchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email('must be an e-mail address')),
  name: z.string().trim().min(1, 'is required').max(120).optional(),
  role: roleSchema,
});
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;

/** Body of POST /api/invitations/:token/accept (public: the token is the proof). */
export const acceptInvitationSchema = z.object({
  name: z.string().trim().min(1, 'is required').max(120),
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
export const updateMemberRoleSchema = z.object({ role: roleSchema });
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
export const projectMemberListSchema = z.object({ members: z.array(projectMemberSchema) });
export const addProjectMemberSchema = z.object({ userId: z.uuid('must be a user id (UUID)') });
export type AddProjectMemberInput = z.infer<typeof addProjectMemberSchema>;
