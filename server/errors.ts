import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ApiErrorBody } from '../shared/schemas/error';

/** Any failure a client should hear about, with its HTTP status and a stable code. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly line?: number,
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found`);
export const forbidden = (message = 'Your role does not allow this') => new AppError(403, 'forbidden', message);

function zodMessage(err: ZodError): string {
  return err.issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message)).join('; ');
}

/** Turns anything thrown into the one error body; stack traces stay in the server log. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, next) => {
  if (res.headersSent) return next(err);
  let status = 500;
  let body: ApiErrorBody = { error: { code: 'internal', message: 'Something went wrong on the server' } };
  if (err instanceof AppError) {
    status = err.status;
    body = { error: { code: err.code, message: err.message, ...(err.line !== undefined ? { line: err.line } : {}) } };
  } else if (err instanceof ZodError) {
    status = 400;
    body = { error: { code: 'invalid_request', message: zodMessage(err) } };
  } else if (err?.type === 'entity.parse.failed') {
    status = 400;
    body = { error: { code: 'invalid_json', message: 'The request body is not valid JSON' } };
  } else if (err?.type === 'entity.too.large') {
    status = 413;
    body = { error: { code: 'too_large', message: 'The request body is too large' } };
  } else {
    console.error(err);
  }
  res.status(status).json(body);
};
