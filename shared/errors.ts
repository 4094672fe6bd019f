import { z } from 'zod';

/** Error codes of the one JSON error shape `{ error: { code, message, details } }`. */
export const ERROR_CODES = [
  'bad_request',
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'rate_limited',
  'payload_too_large',
  'unsupported_media_type',
  'internal',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(ERROR_CODES),
    message: z.string(),
    details: z.unknown().optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;

/** One problem with one field, e.g. from a form or a CSV row. `row` is 1-based as a user counts lines. */
export interface FieldIssue {
  path: string;
  message: string;
  row?: number;
}
