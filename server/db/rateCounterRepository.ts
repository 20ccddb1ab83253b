import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import type { Db } from './client';
import { rateCounters } from './schema';

/** Whether the event may go ahead, and if not, in how many seconds it may (at least 1). */
export interface Verdict {
  allowed: boolean;
  retryAfterS: number;
}

const seconds = (us: unknown) => Math.max(1, Math.ceil(Number(us) / 1e6));
/** Intervals go to SQL as whole microseconds: settings in minutes may give fractions of a second. */
const us = (s: number) => Math.round(s * 1e6);

/**
 * Counts one more event under `key` in a fixed window of `windowS` seconds that opens with the first
 * event, and says whether the count is within `limit`. The upsert is atomic and locks the row until the
 * transaction ends, so the count read back is exactly this event's, whichever process counted it.
 * Refused events count too, which does not extend the window.
 */
export async function countInWindow(db: Db, key: string, limit: number, windowS: number): Promise<Verdict> {
  return db.transaction(async (tx) => {
    // Both IF()s read the row as it was: MariaDB assigns left to right, and window_ends_at is assigned last.
    await tx.execute(sql`
      INSERT INTO ${rateCounters} (counter_key, hits, window_ends_at) VALUES (${key}, 1, NOW(3) + INTERVAL ${us(windowS)} MICROSECOND)
      ON DUPLICATE KEY UPDATE
        hits = IF(window_ends_at <= NOW(3), 1, hits + 1),
        window_ends_at = IF(window_ends_at <= NOW(3), NOW(3) + INTERVAL ${us(windowS)} MICROSECOND, window_ends_at)`);
    const [row] = await tx
      .select({ hits: rateCounters.hits, remainingUs: sql<number>`TIMESTAMPDIFF(MICROSECOND, NOW(3), ${rateCounters.windowEndsAt})` })
      .from(rateCounters)
      .where(eq(rateCounters.counterKey, key));
    return { allowed: row.hits <= limit, retryAfterS: seconds(row.remainingUs) };
  });
}

/** Takes back one event counted by countInWindow, e.g. a sign-in that turned out to be right. */
export async function uncount(db: Db, key: string): Promise<void> {
  await db.update(rateCounters).set({ hits: sql`GREATEST(${rateCounters.hits}, 1) - 1` }).where(eq(rateCounters.counterKey, key));
}

/**
 * Spaced attempts: answers whether an attempt under `key` may go ahead now and, if so, counts it and
 * sets when the next one may, `spacingS(count)` seconds later. The count starts over after `windowS`
 * seconds without an attempt. Check and count are one locked step, so a burst of parallel attempts
 * cannot all pass the check before any of them is counted.
 */
export async function claimSpacedAttempt(db: Db, key: string, windowS: number, spacingS: (count: number) => number): Promise<Verdict> {
  return db.transaction(async (tx) => {
    // Creates the row if needed and, either way, locks it for the rest of the transaction.
    await tx.execute(sql`
      INSERT INTO ${rateCounters} (counter_key, hits, window_ends_at, next_allowed_at) VALUES (${key}, 0, NOW(3), NOW(3))
      ON DUPLICATE KEY UPDATE counter_key = counter_key`);
    const [row] = await tx
      .select({
        hits: rateCounters.hits,
        expired: sql<number>`${rateCounters.windowEndsAt} <= NOW(3)`,
        waitUs: sql<number>`TIMESTAMPDIFF(MICROSECOND, NOW(3), COALESCE(${rateCounters.nextAllowedAt}, NOW(3)))`,
      })
      .from(rateCounters)
      .where(eq(rateCounters.counterKey, key))
      .for('update');
    if (Number(row.waitUs) > 0) return { allowed: false, retryAfterS: seconds(row.waitUs) };
    const count = Number(row.expired) ? 1 : row.hits + 1;
    await tx
      .update(rateCounters)
      .set({
        hits: count,
        windowEndsAt: sql`NOW(3) + INTERVAL ${us(windowS)} MICROSECOND`,
        nextAllowedAt: sql`NOW(3) + INTERVAL ${us(spacingS(count))} MICROSECOND`,
      })
      .where(eq(rateCounters.counterKey, key));
    return { allowed: true, retryAfterS: 0 };
  });
}

export async function deleteCounter(db: Db, key: string): Promise<void> {
  await db.delete(rateCounters).where(eq(rateCounters.counterKey, key));
}

/** Removes counters whose window and spacing have both run out; they would start over anyway. */
export async function deleteSpentCounters(db: Db): Promise<void> {
  await db
    .delete(rateCounters)
    .where(and(lt(rateCounters.windowEndsAt, sql`NOW(3)`), or(isNull(rateCounters.nextAllowedAt), lt(rateCounters.nextAllowedAt, sql`NOW(3)`))));
}
