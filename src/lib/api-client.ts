import { errorBodySchema, type ErrorCode, type FieldIssue } from '../../shared/errors';
import type { z } from 'zod';

/** A failed API call: the HTTP status and the server's `{ error: { code, message, details } }`. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ErrorCode | 'network' | 'bad_response';
  readonly details: unknown;

  constructor(status: number, code: ApiError['code'], message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }

  /** Field problems the server named (`validation_failed`, or e.g. a `conflict` on one field); empty when none. */
  get fieldIssues(): FieldIssue[] {
    if (!Array.isArray(this.details)) return [];
    return this.details.filter(
      (d): d is FieldIssue => typeof d === 'object' && d !== null && typeof d.path === 'string' && typeof d.message === 'string',
    );
  }
}

type UnauthenticatedListener = () => void;
const unauthenticatedListeners = new Set<UnauthenticatedListener>();

/** Called whenever a request that needs a session gets 401; the app uses it to send the user to sign-in. */
export function onUnauthenticated(listener: UnauthenticatedListener): () => void {
  unauthenticatedListeners.add(listener);
  return () => unauthenticatedListeners.delete(listener);
}

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  /** Validates the JSON answer; omit for 204 answers. */
  schema?: z.ZodType<T>;
  /** A 401 is an expected answer here (sign-in, "who am I"), so it does not trigger the sign-in redirect. */
  allowUnauthenticated?: boolean;
  signal?: AbortSignal;
}

/**
 * One call to the Kilowatch API. Sends the session cookie, sends JSON with `Content-Type: application/json` on
 * every non-GET request, and turns any error answer into an ApiError.
 */
export async function apiRequest<T = void>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (method !== 'GET') headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: method === 'GET' ? undefined : JSON.stringify(options.body ?? {}),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network', 'The Kilowatch server cannot be reached. Check the connection and try again.');
  }

  if (!response.ok) {
    const error = await readError(response);
    if (response.status === 401 && !options.allowUnauthenticated) unauthenticatedListeners.forEach((l) => l());
    throw error;
  }
  if (response.status === 204 || !options.schema) return undefined as T;

  const json: unknown = await response.json().catch(() => undefined);
  const parsed = options.schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError(response.status, 'bad_response', `The server's answer to ${method} ${path} was not in the expected form.`, parsed.error.issues);
  }
  return parsed.data;
}

async function readError(response: Response): Promise<ApiError> {
  const json: unknown = await response.json().catch(() => undefined);
  const parsed = errorBodySchema.safeParse(json);
  if (parsed.success) {
    const { code, message, details } = parsed.data.error;
    return new ApiError(response.status, code, message, details);
  }
  return new ApiError(response.status, response.status >= 500 ? 'internal' : 'bad_request', `The server answered ${response.status} ${response.statusText}.`.trim());
}

/** A message fit to show a user for any thrown value. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}
