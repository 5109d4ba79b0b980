import { z } from 'zod';

export const roles = ['admin', 'engineer', 'owner', 'fabricator', 'viewer'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

/** Roles allowed to create, change or delete projects. */
export const projectEditorRoles: readonly Role[] = ['admin', 'engineer'];

export function canEditProjects(role: Role): boolean {
  return projectEditorRoles.includes(role);
}

/** Roles allowed to manage the organisation's people, roles and invitations. */
export const memberManagerRoles: readonly Role[] = ['admin'];

export function canManageMembers(role: Role): boolean {
  return memberManagerRoles.includes(role);
}
