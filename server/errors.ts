import type { ErrorCode, FieldIssue } from '../shared/errors';
import type { ZodError } from 'zod';

const STATUS: Record<ErrorCode, number> = {
  bad_request: 400,
  validation_failed: 422,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  rate_limited: 429,
  payload_too_large: 413,
  unsupported_media_type: 415,
  internal: 500,
};

/** The one error type services and routes throw; the error middleware turns it into the shared JSON shape. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.status = STATUS[code];
  }
}

export const notFound = (what: string) => new AppError('not_found', `${what} not found`);
export const forbidden = (message = 'Your role does not allow this') => new AppError('forbidden', message);

export function zodIssues(error: ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

export function validationError(error: ZodError, what = 'request'): AppError {
  const issues = zodIssues(error);
  const first = issues[0];
  return new AppError(
    'validation_failed',
    first ? `Invalid ${what}: ${first.path ? `${first.path}: ` : ''}${first.message}` : `Invalid ${what}`,
    issues,
  );
}
