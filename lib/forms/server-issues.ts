import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';

import { ApiError } from '@/lib/api/client';

/**
 * Puts the API's field issues onto the form's own fields. Returns the message to show at the
 * form level: issues for fields the form does not have, or the error's message when no
 * field took it; `null` when every issue found its field.
 */
export function applyServerIssues<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly FieldPath<T>[],
): string | null {
  if (!(error instanceof ApiError)) {
    return error instanceof Error && error.message ? error.message : 'Something went wrong.';
  }
  const known = new Set<string>(fields);
  const leftOver: string[] = [];
  let placed = 0;
  // Each issue goes onto its field, the first one taking the focus
  for (const issue of error.issues) {
    if (known.has(issue.path)) {
      setError(issue.path as FieldPath<T>, { type: 'server', message: issue.message }, { shouldFocus: placed === 0 });
      placed += 1;
    } else {
      leftOver.push(issue.path === '(body)' ? issue.message : `${issue.path}: ${issue.message}`);
    }
  }
  if (leftOver.length) return leftOver.join(' ');
  return placed ? null : error.message;
}
