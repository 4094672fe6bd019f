import { useState } from 'react';
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError, errorMessage } from './api-client';

/**
 * Puts the field issues of a server's error answer on the matching form fields and returns what is left for a
 * message at the top of the form (issues on unknown fields, or the message of any other error); null when every
 * issue found its field.
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

export interface ServerErrors {
  /** Message for the top of the form, or null. */
  problem: string | null;
  /** Pass as the mutation's onError. */
  onError: (error: unknown) => void;
  /** Call when the form is sent again. */
  clear: () => void;
}

/**
 * Server errors of one form: field issues go onto their fields (through react-hook-form's setError, outside
 * render), the rest becomes `problem`. `explain` may turn a known answer (say a 401 at sign-in) into a sentence.
 */
export function useServerErrors<T extends FieldValues>(
  setError: UseFormSetError<T>,
  fieldNames: readonly string[],
  explain?: (error: unknown) => string | null,
): ServerErrors {
  const [problem, setProblem] = useState<string | null>(null);
  return {
    problem,
    onError: (error) => setProblem(explain?.(error) ?? applyServerErrors(error, setError, fieldNames)),
    clear: () => setProblem(null),
  };
}
