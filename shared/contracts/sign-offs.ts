import { z } from 'zod';
import { typeError } from './messages';
import { comfortCriteriaSchema, projectParamsSchema, savedLoadCaseSchema, savedModeSchema } from './model';
import { variantSchema } from './variants';

/**
 * Sign-off of a tuning variant: an engineer or admin submits it, an owner of the organisation approves or returns it.
 * The snapshot keeps everything the approval rests on, copied at submission; an approved design is frozen
 * (docs/decisions/0019-sign-off-freeze.md).
 */

export const signOffStatuses = ['submitted', 'approved', 'returned'] as const;
export const signOffStatusSchema = z.enum(signOffStatuses);
export type SignOffStatus = z.infer<typeof signOffStatusSchema>;

export const mailStates = ['pending', 'sent', 'failed'] as const;
export const mailStateSchema = z.enum(mailStates);

const uuid = (what: string) => z.uuid(`must be ${what} id (UUID)`);
const text = (max: number) =>
  z
    .string({ error: typeError('must be text') })
    .trim()
    .max(max, `must be at most ${max} characters`)
    .refine((value) => !value.includes('\u0000'), 'must not contain NUL characters');

export const signOffParamsSchema = projectParamsSchema.extend({ signOffId: uuid('a sign-off') });

export const submitSignOffSchema = z.strictObject({
  variantId: uuid('a tuning variant'),
  message: text(4000).optional(),
});
export type SubmitSignOffInput = z.infer<typeof submitSignOffSchema>;

export const approveSignOffSchema = z.strictObject({ comment: text(4000).optional() });
export type ApproveSignOffInput = z.infer<typeof approveSignOffSchema>;

export const returnSignOffSchema = z.strictObject({
  comment: text(4000).min(1, 'must say what to change (a returned design needs a comment)'),
});
export type ReturnSignOffInput = z.infer<typeof returnSignOffSchema>;

/** What the approval rests on, as it was at submission. */
export const signOffSnapshotSchema = z.object({
  variant: variantSchema,
  mode: savedModeSchema,
  loadCases: z.array(savedLoadCaseSchema),
  criteria: comfortCriteriaSchema,
  /** The engine version the result was computed with (also in variant.result). */
  engineVersion: z.string(),
});
export type SignOffSnapshot = z.infer<typeof signOffSnapshotSchema>;

export const signOffMailSchema = z.object({
  to: z.string(),
  state: mailStateSchema,
  attempts: z.number().int(),
});

export const signOffSchema = z.object({
  id: z.string(),
  projectId: z.string(),
  variantId: z.string(),
  criteriaId: z.string(),
  status: signOffStatusSchema,
  message: z.string().nullable(),
  submittedBy: z.string().nullable(),
  submittedAt: z.string(),
  decidedBy: z.string().nullable(),
  /** The decider's name and e-mail as they were at the decision (null before it, and on older decisions). */
  decidedByName: z.string().nullable(),
  decidedByEmail: z.string().nullable(),
  decidedAt: z.string().nullable(),
  decisionComment: z.string().nullable(),
  snapshot: signOffSnapshotSchema,
  mails: z.array(signOffMailSchema),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type SignOff = z.infer<typeof signOffSchema>;

export const signOffListSchema = z.object({ signOffs: z.array(signOffSchema) });
export type SignOffList = z.infer<typeof signOffListSchema>;

/** GET …/sign-offs/:signOffId/hardware-sheet: the rows the CSV and the PDF carry (shared/compute/hardware-sheet.ts). */
export const hardwareSheetSchema = z.object({
  projectName: z.string(),
  variantName: z.string(),
  revision: z.string(),
  rows: z.array(z.object({ section: z.string(), quantity: z.string(), value: z.union([z.number(), z.string()]), unit: z.string(), note: z.string() })),
  caution: z.string(),
});
export type HardwareSheetAnswer = z.infer<typeof hardwareSheetSchema>;
