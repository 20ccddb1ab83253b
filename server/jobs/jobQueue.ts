import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { jobs } from '../db/schema';

export interface ClaimedJob {
  id: number;
  captureId: number;
  kind: 'ingest' | 'reanalyse';
  attempts: number;
}

/** A job is retried this often before its capture is marked failed. */
export const MAX_ATTEMPTS = 3;

/**
 * Claims the oldest queued job, or a running one whose worker stopped heartbeating `staleSeconds` ago
 * (its process died). SKIP LOCKED lets several server processes claim side by side without waiting on
 * or taking each other's rows.
 */
export async function claimJob(db: Db, workerId: string, staleSeconds: number): Promise<ClaimedJob | null> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ id: jobs.id, captureId: jobs.captureId, kind: jobs.kind, attempts: jobs.attempts })
      .from(jobs)
      .where(sql`${jobs.status} = 'queued' OR (${jobs.status} = 'running' AND ${jobs.heartbeatAt} < NOW() - INTERVAL ${staleSeconds} SECOND)`)
      .orderBy(jobs.id)
      .limit(1)
      .for('update', { skipLocked: true });
    if (!row) return null;
    await tx
      .update(jobs)
      .set({ status: 'running', lockedBy: workerId, heartbeatAt: sql`NOW()`, attempts: sql`${jobs.attempts} + 1` })
      .where(eq(jobs.id, row.id));
    return { ...row, attempts: row.attempts + 1 };
  });
}

/** Tells other processes the job's worker is alive. */
export async function heartbeat(db: Db, jobId: number, workerId: string): Promise<void> {
  await db.update(jobs).set({ heartbeatAt: sql`NOW()` }).where(and(eq(jobs.id, jobId), eq(jobs.lockedBy, workerId)));
}

/** Where a job still belongs to this worker: the condition every finishing write carries. */
export const ownedBy = (jobId: number, workerId: string) => and(eq(jobs.id, jobId), eq(jobs.lockedBy, workerId), eq(jobs.status, 'running'));

/** Queues a capture for processing; pass the transaction that creates or resets the capture. */
export async function enqueue(db: Pick<Db, 'insert'>, captureId: number, kind: 'ingest' | 'reanalyse'): Promise<void> {
  await db.insert(jobs).values({ captureId, kind });
}
