import type { AppContext } from '../context';
import { claimSpacedAttempt, deleteCounter, uncount } from '../db/rateCounterRepository';
import { countRequest, TooManyRequests, waitPhrase } from './requestLimits';
import { hashSecretToken } from './secretTokens';

const addressKey = (address: string) => `login-ip:${address}`;
/** The e-mail is hashed: the counters need not hold who was tried. */
const accountKey = (email: string) => `login-account:${hashSecretToken(email.trim().toLowerCase())}`;

/**
 * Seconds before the next sign-in attempt of an account after its `failures`-th failure in a row: none
 * for the first `free`, then 1, 2, 4, 8 … seconds, never more than `capS`. It slows a guesser down
 * without ever locking the real owner out for long.
 */
export function accountDelayS(failures: number, free: number, capS: number): number {
  if (failures <= free) return 0;
  return Math.min(capS, 2 ** Math.min(failures - free - 1, 30));
}

/**
 * Lets a sign-in attempt go ahead, or throws 429. Each attempt is counted as a failure up front (and
 * taken back by signInSucceeded), so parallel guesses cannot all slip through before one is counted.
 * Per address: at most LOGIN_MAX_FAILURES per LOGIN_WINDOW_MINUTES. Per account: only a short, growing
 * delay, so that guesses from many addresses slow down but the owner is never locked out; while it
 * runs the password is not even checked.
 */
export async function admitSignIn(ctx: AppContext, address: string, email: string): Promise<void> {
  const { LOGIN_MAX_FAILURES, LOGIN_WINDOW_MINUTES, LOGIN_ACCOUNT_FREE_FAILURES, LOGIN_ACCOUNT_MAX_DELAY_SECONDS } = ctx.config;
  const windowS = LOGIN_WINDOW_MINUTES * 60;
  await countRequest(ctx, addressKey(address), LOGIN_MAX_FAILURES, windowS, { code: 'too_many_attempts', message: 'Too many failed sign-ins from your address' });
  const spacing = (failures: number) => accountDelayS(failures, LOGIN_ACCOUNT_FREE_FAILURES, LOGIN_ACCOUNT_MAX_DELAY_SECONDS);
  const verdict = await claimSpacedAttempt(ctx.db, accountKey(email), windowS, spacing);
  if (!verdict.allowed) {
    throw new TooManyRequests(verdict.retryAfterS, 'too_many_attempts', `Several wrong passwords were tried for this account; try again ${waitPhrase(verdict.retryAfterS)}`);
  }
}

/** A right password: the attempt was no failure, and the account starts over. */
export async function signInSucceeded(ctx: AppContext, address: string, email: string): Promise<void> {
  await uncount(ctx.db, addressKey(address));
  await deleteCounter(ctx.db, accountKey(email));
}

/** After a password reset the owner starts with a clean slate. */
export const clearAccountThrottle = (ctx: AppContext, email: string) => deleteCounter(ctx.db, accountKey(email));
