import { z } from 'zod';

/** The one error shape every API route and the `calc` command return. */
export const apiIssueSchema = z.object({
  path: z.string(),
  message: z.string(),
});

export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    issues: z.array(apiIssueSchema),
  }),
});

export type ApiIssue = z.infer<typeof apiIssueSchema>;
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;

/** Turns zod issues into `{ path, message }` pairs; the path is dotted (`structure.frequencyHz`, `tmds.0.massKg`). */
export function toApiIssues(error: z.ZodError): ApiIssue[] {
  return error.issues.flatMap((issue) => {
    if (issue.code === 'unrecognized_keys') {
      // One issue per unknown key, named by its own path, so that a misspelt field is pointed at directly.
      return issue.keys.map((key) => {
        const path = [...issue.path.map(String), key].join('.');
        return { path, message: `${path}: is not a known field (check its spelling; unknown fields are refused)` };
      });
    }
    const path = issue.path.map(String).join('.');
    return [{ path, message: path ? `${path}: ${issue.message}` : issue.message }];
  });
}
