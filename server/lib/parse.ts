import { z, type ZodType } from 'zod';
import { AppError, validationError } from '../errors';

/** Parses a request body (or query) with a shared schema; a failure is a 422 naming each field. */
export function parseBody<T extends ZodType>(schema: T, value: unknown, what = 'request'): z.infer<T> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw validationError(parsed.error, what);
  return parsed.data;
}

const uuid = z.uuid();

/** A path id; anything that is not a UUID cannot name a row, so it is a 404. */
export function idParam(value: string | string[] | undefined, what: string): string {
  const v = Array.isArray(value) ? value[0] : value;
  if (!uuid.safeParse(v).success) throw new AppError('not_found', `${what} not found`);
  return v as string;
}
