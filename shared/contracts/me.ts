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
