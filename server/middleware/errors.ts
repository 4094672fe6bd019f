import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { ZodError } from 'zod';
import type { ErrorBody } from '../../shared/errors';
import { AppError, validationError } from '../errors';

export const notFoundApi: RequestHandler = (req) => {
  throw new AppError('not_found', `No API route ${req.method} ${req.path}`);
};

/** The one error middleware: every failure leaves as `{ error: { code, message, details } }`. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  let appError: AppError;
  if (err instanceof AppError) appError = err;
  else if (err instanceof ZodError) appError = validationError(err);
  else if (err instanceof multer.MulterError) {
    appError =
      err.code === 'LIMIT_FILE_SIZE'
        ? new AppError('payload_too_large', `The file is larger than the upload limit (${err.field ?? 'file'})`)
        : new AppError('bad_request', `Upload refused: ${err.message}`);
  } else if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.parse.failed') {
    appError = new AppError('bad_request', 'The request body is not valid JSON');
  } else if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.too.large') {
    appError = new AppError('payload_too_large', 'The request body is too large');
  } else {
    console.error(err);
    appError = new AppError('internal', 'Something went wrong on the server; the error has been logged');
  }
  const body: ErrorBody = { error: { code: appError.code, message: appError.message, details: appError.details } };
  res.status(appError.status).json(body);
};
