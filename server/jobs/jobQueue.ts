import { randomBytes } from 'node:crypto';
import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Db, DbOrTx } from '../db/client';
import { captures, jobs } from '../db/schema';

export interface ClaimedJob {
  id: number;
  captureId: number;
  kind: 'ingest' | 'reanalyse';
  /** Counting this claim: a job whose process died mid-run comes back with a higher count. */
  attempts: number;
  /**
   * This claim's mark in jobs.locked_by: the process's worker id and a nonce, so that a second claim of
   * the job, even by the same process (its heartbeat lapsed while the database was away), owns it alone.
   */
  owner: string;
}

/** A new claim's owner mark, `<workerId>/<nonce>`. */
const claimOwner = (workerId: string) => `${workerId}/${randomBytes(4).toString('hex')}`;

/** A job is tried this often; a claim beyond it fails the job, so a poison file cannot come back forever. */
export const MAX_ATTEMPTS = 3;

/**
 * Claims the oldest queued job, or a running one whose worker stopped heartbeating `staleSeconds` ago
 * (its process died), skipping captures that another worker is processing. SKIP LOCKED lets several
 * server processes claim side by side without waiting on or taking each other's rows.
 *
 * Read committed, and the capture row locked before the last check: two processes picking two jobs of
 * one capture at the same moment are serialised there, and the second sees the first's claim.
 */
export async function claimJob(db: Db, workerId: string, staleSeconds: number): Promise<ClaimedJob | null> {
  const stale = sql`${jobs.heartbeatAt} < NOW() - INTERVAL ${staleSeconds} SECOND`;
  return db.transaction(
    async (tx) => {
      const [row] = await tx
        .select({ id: jobs.id, captureId: jobs.captureId, kind: jobs.kind, attempts: jobs.attempts })
        .from(jobs)
        .where(
          sql`(${jobs.status} = 'queued' OR (${jobs.status} = 'running' AND ${stale}))
              AND NOT EXISTS (SELECT 1 FROM jobs AS busy WHERE busy.capture_id = ${jobs.captureId} AND busy.id <> ${jobs.id}
                              AND busy.status = 'running' AND busy.heartbeat_at >= NOW() - INTERVAL ${staleSeconds} SECOND)`,
        )
        .orderBy(jobs.id)
        .limit(1)
        .for('update', { skipLocked: true });
      if (!row) return null;
      await tx.select({ id: captures.id }).from(captures).where(eq(captures.id, row.captureId)).for('update');
      const [busy] = await tx
        .select({ id: jobs.id })
        .from(jobs)
        .where(and(eq(jobs.captureId, row.captureId), eq(jobs.status, 'running'), sql`${jobs.id} <> ${row.id}`, sql`NOT (${stale})`))
        .limit(1);
      if (busy) return null;
      const owner = claimOwner(workerId);
      await tx
        .update(jobs)
        .set({ status: 'running', lockedBy: owner, heartbeatAt: sql`NOW()`, attempts: sql`${jobs.attempts} + 1` })
        .where(eq(jobs.id, row.id));
      return { ...row, attempts: row.attempts + 1, owner };
    },
    { isolationLevel: 'read committed' },
  );
}

/** Tells other processes the job's worker is alive. */
export async function heartbeat(db: Db, job: ClaimedJob): Promise<void> {
  await db.update(jobs).set({ heartbeatAt: sql`NOW()` }).where(and(eq(jobs.id, job.id), eq(jobs.lockedBy, job.owner)));
}

/** Where a job still belongs to this claim: the condition every finishing write carries. */
export const ownedBy = (job: ClaimedJob) => and(eq(jobs.id, job.id), eq(jobs.lockedBy, job.owner), eq(jobs.status, 'running'));

/**
 * Gives a job back to the queue when its worker stops on purpose (a shutdown), without counting the
 * interrupted run as an attempt: the next start picks it up at once rather than after a stale period.
 */
export async function releaseJob(db: Db, job: ClaimedJob): Promise<void> {
  await db
    .update(jobs)
    .set({ status: 'queued', lockedBy: null, heartbeatAt: null, attempts: sql`GREATEST(${jobs.attempts} - 1, 0)` })
    .where(ownedBy(job));
}

/**
 * Queues a capture for processing unless a job for it is already waiting or running (a second
 * re-analysis request, or two admins at once, must not process one capture twice side by side).
 * The capture's row is locked first, so two requests for one capture are served one after the other.
 * (Not one INSERT … SELECT … WHERE NOT EXISTS on jobs: under concurrent uploads MariaDB fails that with
 * ER_AUTOINC_READ_FAILED, seen in the bench's load step.) Pass the transaction that creates or resets
 * the capture, or the database. Returns whether a job was added.
 */
export async function enqueue(db: Pick<Db, 'transaction'>, captureId: number, kind: 'ingest' | 'reanalyse'): Promise<boolean> {
  return db.transaction(async (tx) => {
    await tx.select({ id: captures.id }).from(captures).where(eq(captures.id, captureId)).for('update');
    const [pending] = await tx
      .select({ id: jobs.id })
      .from(jobs)
      .where(and(eq(jobs.captureId, captureId), inArray(jobs.status, ['queued', 'running'])))
      .limit(1);
    if (pending) return false;
    await tx.insert(jobs).values({ captureId, kind });
    return true;
  });
}

/**
 * Queues the ingest of a capture just created in `tx`, already claimed by `workerId` (as claimJob would
 * leave it): the process that read the upload as it arrived processes it, and the heartbeat and
 * ownership rules apply as to any claimed job, so another process takes it over only if this one dies.
 */
export async function enqueueClaimed(tx: DbOrTx, captureId: number, workerId: string): Promise<ClaimedJob> {
  const owner = claimOwner(workerId);
  const [{ id }] = await tx.insert(jobs).values({ captureId, kind: 'ingest', status: 'running', lockedBy: owner, heartbeatAt: sql`NOW()`, attempts: 1 }).$returningId();
  return { id, captureId, kind: 'ingest', attempts: 1, owner };
}
