import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { describeError, isApiError, issueMessage } from '../../../lib/api-client';

/**
 * Puts the server's `issues[].path` messages under the matching form fields. Returns what is left for a notice
 * above the form: the issues that match no field, or the error's message when it named no field at all, or null.
 */
export function applyServerIssues<T extends FieldValues>(
  error: unknown,
  fields: readonly Path<T>[],
  setError: UseFormSetError<T>,
): string | null {
  if (!isApiError(error) || error.issues.length === 0) return describeError(error);
  const rest: string[] = [];
  for (const issue of error.issues) {
    const field = fields.find((name) => issue.path === name || issue.path.startsWith(`${name}.`));
    if (field) setError(field, { type: 'server', message: issueMessage(issue) }, { shouldFocus: true });
    else rest.push(issue.message);
  }
  return rest.length ? rest.join(' ') : null;
}
