import type { AppContext } from '../context';
import { countInWindow, deleteSpentCounters } from '../db/rateCounterRepository';
import { AppError } from '../errors';

/** A 429 that knows when to come back; the Retry-After header is set from it. */
export class TooManyRequests extends AppError {
  constructor(
    readonly retryAfterS: number,
    code: string,
    message: string,
  ) {
    super(429, code, message);
  }
}

/** "in 40 seconds", "in 12 minutes": for messages a person reads. */
export const waitPhrase = (s: number) => (s < 90 ? `in ${s} second${s === 1 ? '' : 's'}` : `in ${Math.ceil(s / 60)} minutes`);

/** How often this process sweeps out spent counters: cheap, and keeps the table to the keys in use. */
const SWEEP_EVERY = 500;
let counted = 0;

/**
 * Counts one request under `key` (at most `limit` per `windowS` seconds, in the database, so every
 * server process shares the count) and throws a 429 with the time to wait when it is over.
 */
export async function countRequest(ctx: AppContext, key: string, limit: number, windowS: number, refusal: { code: string; message: string }): Promise<void> {
  if (++counted % SWEEP_EVERY === 0) await deleteSpentCounters(ctx.db);
  const verdict = await countInWindow(ctx.db, key, limit, windowS);
  if (!verdict.allowed) throw new TooManyRequests(verdict.retryAfterS, refusal.code, `${refusal.message}; try again ${waitPhrase(verdict.retryAfterS)}`);
}
