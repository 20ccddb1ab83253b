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

/** mysql2's codes for a database that cannot be reached or dropped the connection. */
const DATABASE_AWAY = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'PROTOCOL_CONNECTION_LOST', 'ER_CON_COUNT_ERROR', 'ER_SERVER_SHUTDOWN', 'POOL_CLOSED', 'PROTOCOL_SEQUENCE_TIMEOUT']);

/** Whether an error (or the driver error drizzle wraps in `cause`) means the database is unavailable. */
export function isDatabaseAway(err: unknown): boolean {
  for (let e = err as { code?: string; cause?: unknown } | undefined, depth = 0; e && depth < 4; e = e.cause as typeof e, depth++) {
    if (typeof e.code === 'string' && DATABASE_AWAY.has(e.code)) return true;
  }
  return false;
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
  } else if (isDatabaseAway(err)) {
    // Nothing was changed; the client may simply try again.
    status = 503;
    body = { error: { code: 'unavailable', message: 'The database cannot be reached right now; try again in a moment' } };
    res.set('Retry-After', '5');
    console.error('database unavailable:', (err as Error).message);
  } else {
    console.error(err);
  }
  res.status(status).json(body);
};
