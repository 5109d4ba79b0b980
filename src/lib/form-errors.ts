import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import type { ApiIssue } from '../../shared/contracts';
import { describeError, isApiError, issueMessage, issuesFor } from './api-client';

/**
 * Puts the server's `issues[].path` messages under the matching form fields (a field also takes the issues below
 * it, `tmds.0` under `tmds`; it shows the first of them) and moves the focus to the first such field in form order. Returns what is left for a
 * notice above the form: the issues that match no field, or the error's message when it named no field at all, or null.
 */
export function applyServerIssues<T extends FieldValues>(
  error: unknown,
  fields: readonly Path<T>[],
  setError: UseFormSetError<T>,
): string | null {
  if (!isApiError(error) || error.issues.length === 0) return describeError(error);
  const placed = new Set<ApiIssue>();
  for (const field of fields) {
    const issues = issuesFor(error, field);
    if (issues.length === 0) continue;
    const first = placed.size === 0;
    for (const issue of issues) placed.add(issue);
    setError(field, { type: 'server', message: issueMessage(issues[0]) }, { shouldFocus: first });
  }
  const rest = error.issues.filter((issue) => !placed.has(issue)).map((issue) => issue.message);
  return rest.length ? rest.join(' ') : null;
}
