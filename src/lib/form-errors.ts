import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError, errorMessage } from './api-client';

/**
 * Puts a server's `validation_failed` issues on the matching form fields and returns what is left for a message
 * at the top of the form (issues on unknown fields, or the message of any other error); null when every issue
 * found its field.
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fieldNames: readonly string[]): string | null {
  if (!(error instanceof ApiError) || error.fieldIssues.length === 0) return errorMessage(error);
  const known = new Set(fieldNames);
  const leftOver: string[] = [];
  for (const issue of error.fieldIssues) {
    const path = issue.path.replace(/\[(\d+)\]/g, '.$1');
    const root = path.split('.')[0];
    if (known.has(path) || known.has(root)) {
      setError((known.has(path) ? path : root) as Path<T>, { type: 'server', message: issue.message });
    } else {
      leftOver.push(issue.path ? `${issue.path}: ${issue.message}` : issue.message);
    }
  }
  return leftOver.length > 0 ? leftOver.join(' ') : null;
}
