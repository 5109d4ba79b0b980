import { z } from 'zod';
import { roleSchema } from './roles';

/** GET /api/config (public): what the client needs to know about how the server runs. */
export const appConfigSchema = z.object({
  mode: z.enum(['development', 'test', 'production']),
  /** Demo accounts, listed on the sign-in page outside production only (the password is documented in the README). */
  demoAccounts: z.array(z.object({ email: z.string(), role: roleSchema })),
  demoPassword: z.string().nullable(),
  /** True when the development mailbox (/api/dev/mail) is available. */
  devMailbox: z.boolean(),
});
export type AppConfig = z.infer<typeof appConfigSchema>;

/** GET /api/dev/mail (development and test only): mails caught by the local fake SMTP server, newest first. */
export const devMailSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  receivedAt: z.string(),
});
export const devMailListSchema = z.object({ mails: z.array(devMailSchema) });
export type DevMail = z.infer<typeof devMailSchema>;
