import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from './errors.js';

/** Unknown /api paths answer in the error shape, never with the web app's HTML. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `There is no ${req.method} ${req.path}.`));
};

/** Maps every error to {"error":{code,message,details}}; no stack traces reach clients. */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const known = toAppError(error);
  if (known.status >= 500) req.log?.error({ err: error }, 'request failed');
  res.status(known.status).json({ error: { code: known.code, message: known.message, details: known.details } });
};

function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  const e = error as { status?: number; statusCode?: number; type?: string; code?: string; message?: string };
  const status = e.status ?? e.statusCode;
  if (e.type === 'entity.too.large') return new AppError(413, 'too_large', 'The request body is too large.');
  if (e.type === 'entity.parse.failed') return new AppError(400, 'invalid_json', 'The request body is not valid JSON.');
  if (e.code === 'EBADCSRFTOKEN')
    return new AppError(403, 'csrf_invalid', 'Missing or invalid CSRF token: send the x-csrf-token header.');
  if (status && status >= 400 && status < 500) return new AppError(status, 'bad_request', e.message ?? 'Bad request.');
  return new AppError(
    500,
    'internal',
    'Something went wrong on the server. The error is logged; try again or tell an administrator.',
  );
}
