import { randomBytes } from 'node:crypto';

/** Longest error message stored for a capture: enough for a clear sentence, never a whole cell. */
export const MAX_STORED_MESSAGE = 500;

export const shortMessage = (message: string) => (message.length <= MAX_STORED_MESSAGE ? message : `${message.slice(0, MAX_STORED_MESSAGE - 1)}…`);

/**
 * What users (and share recipients) read when processing failed for a reason that is not the file's:
 * a reference, with the details written to the server log only (they may hold SQL or paths).
 */
export function unexpectedFailure(captureId: number, err: unknown, what = 'processing failed unexpectedly'): string {
  const reference = `${captureId}-${randomBytes(3).toString('hex')}`;
  console.error(`capture ${captureId}: ${what} (reference ${reference}):`, err);
  return `${what[0].toUpperCase()}${what.slice(1)} (reference ${reference}). Try again later, or ask your administrator with this reference.`;
}
