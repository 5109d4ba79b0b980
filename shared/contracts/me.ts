import { z } from 'zod';
import { roleSchema } from './roles';

export const meSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  organisation: z.object({ id: z.string(), name: z.string() }),
});
export type Me = z.infer<typeof meSchema>;

/** Body of PUT /api/me/password: the signed-in person changes their own password. */
export const changePasswordSchema = z.strictObject({
  currentPassword: z.string().min(1, 'is required').max(200),
  newPassword: z.string().min(10, 'must be at least 10 characters').max(200),
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
