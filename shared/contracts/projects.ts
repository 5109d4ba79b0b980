import { z } from 'zod';
import { pagingSchema } from './paging';

export const projectKinds = ['footbridge', 'floor'] as const;
export const projectKindSchema = z.enum(projectKinds);
export type ProjectKind = z.infer<typeof projectKindSchema>;

/** Text a person types: trimmed, bounded, and without NUL characters (which no text column can store). */
const trimmed = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `must be at most ${max} characters`)
    .refine((value) => !value.includes('\u0000'), 'must not contain a NUL character (\\u0000)');

/** The largest version PostgreSQL's integer column holds. */
export const maxProjectVersion = 2_147_483_647;

export const projectIdParamsSchema = z.object({
  id: z.uuid('must be a project id (UUID)'),
});

/** Body of POST /api/projects, also the resolver of the client's create form. */
export const createProjectSchema = z.strictObject({
  name: trimmed(120).min(1, 'is required'),
  kind: projectKindSchema,
  location: trimmed(200).optional(),
  description: trimmed(4000).optional(),
});
export type CreateProjectInput = z.infer<typeof createProjectSchema>;

/** Body of PATCH /api/projects/:id: the version read by the client (optimistic concurrency) plus the fields to change. */
export const updateProjectSchema = z.strictObject({
  version: z.number().int('must be a whole number').min(1, 'must be 1 or more').max(maxProjectVersion, `must be at most ${maxProjectVersion}`),
  name: trimmed(120).min(1, 'is required').optional(),
  kind: projectKindSchema.optional(),
  location: trimmed(200).nullable().optional(),
  description: trimmed(4000).nullable().optional(),
});
export type UpdateProjectInput = z.infer<typeof updateProjectSchema>;

export const projectSchema = z.object({
  id: z.string(),
  organisationId: z.string(),
  name: z.string(),
  kind: projectKindSchema,
  location: z.string().nullable(),
  description: z.string().nullable(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Project = z.infer<typeof projectSchema>;

export const projectListSchema = z.object({ projects: z.array(projectSchema), paging: pagingSchema });
export type ProjectList = z.infer<typeof projectListSchema>;
