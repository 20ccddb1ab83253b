import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import { and, eq, sql } from 'drizzle-orm';
import type { AppContext } from '../context';
import { annotations, captures, channels, jobs, overviews, sampleChunks } from '../db/schema';
import { compressOriginal, readableOriginal } from '../services/originalFiles';
import type { IngestResult } from '../workers/ingestTask';
import { IngestFailure, IngestWorkerClient } from '../workers/IngestWorkerClient';
import { claimJob, heartbeat, MAX_ATTEMPTS, ownedBy, type ClaimedJob } from './jobQueue';

const POLL_MS = 500;

const asBuffer = (u: Uint8Array) => Buffer.from(u.buffer, u.byteOffset, u.byteLength);

const describe = (err: unknown) => {
  const e = err as Error & { cause?: Error };
  return e.cause ? `${e.message}: ${e.cause.message}` : String(e.message ?? err);
};

type Tx = Parameters<Parameters<AppContext['db']['transaction']>[0]>[0];

/**
 * Removes what an earlier run stored for a capture (a retry, a re-analysis). Only when there is
 * something: a DELETE over an empty range takes gap locks that deadlock with other captures' inserts.
 */
async function clearStoredSamples(tx: Tx, captureId: number): Promise<void> {
  const [existing] = await tx.select({ n: sql<number>`COUNT(*)` }).from(channels).where(eq(channels.captureId, captureId));
  if (Number(existing.n) === 0) return;
  for (const table of [sampleChunks, overviews, channels]) await tx.delete(table).where(eq(table.captureId, captureId));
  // Suggestions not yet acted on are replaced by the new run's; accepted or dismissed ones stay.
  await tx.delete(annotations).where(and(eq(annotations.captureId, captureId), eq(annotations.source, 'finder'), eq(annotations.state, 'suggested')));
}

/** InnoDB may pick a transaction as a deadlock victim; it is then safe to run it again. */
async function retryOnDeadlock<T>(fn: () => Promise<T>, tries = 4): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await fn();
    } catch (err) {
      const code = (err as { cause?: { errno?: number } }).cause?.errno ?? (err as { errno?: number }).errno;
      if (code !== 1213 || i >= tries) throw err;
    }
  }
}

/**
 * Takes capture jobs from the shared queue one at a time, runs parsing and analysis in worker threads,
 * and stores the outcome in one transaction: a capture becomes ready with all its samples and analysis,
 * or failed with its error and no samples. A write whose job was meanwhile taken over by another
 * process (after a missed heartbeat) is rolled back, so each capture is processed exactly once.
 */
export class CaptureProcessor {
  readonly workerId = `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;
  private readonly worker: IngestWorkerClient;
  private running = false;
  private wake: (() => void) | null = null;
  private loop: Promise<void> | null = null;
  private background = new Set<Promise<unknown>>();

  constructor(private readonly ctx: AppContext) {
    this.worker = new IngestWorkerClient(ctx.config.INGEST_WORKERS);
  }

  start(): void {
    if (this.running) return;
    this.running = true;
    this.loop = this.run();
  }

  /** Looks at the queue now rather than at the next poll (after an upload). */
  nudge(): void {
    this.wake?.();
  }

  /** Stops after the current job and waits for background work. */
  async stop(): Promise<void> {
    this.running = false;
    this.nudge();
    await this.loop;
    await Promise.allSettled([...this.background]);
    await this.worker.close();
  }

  /** Stops at once, leaving a running job unfinished, as a killed process would. */
  async abandon(): Promise<void> {
    this.running = false;
    this.nudge();
    await this.worker.close();
    await this.loop?.catch(() => undefined);
  }

  private async run(): Promise<void> {
    while (this.running) {
      let job: ClaimedJob | null = null;
      try {
        job = await claimJob(this.ctx.db, this.workerId, this.ctx.config.JOB_STALE_SECONDS);
        if (job) await this.process(job);
      } catch (err) {
        if (this.running) console.error('capture processing:', err);
      }
      if (!job && this.running) {
        await new Promise<void>((resolve) => {
          const t = setTimeout(resolve, POLL_MS);
          this.wake = () => {
            clearTimeout(t);
            resolve();
          };
        });
        this.wake = null;
      }
    }
  }

  private async process(job: ClaimedJob): Promise<void> {
    const { db } = this.ctx;
    const [capture] = await db.select().from(captures).where(eq(captures.id, job.captureId));
    if (!capture) return;
    await db.update(captures).set({ status: 'processing' }).where(eq(captures.id, capture.id));
    // Four heartbeats per stale period, so a live worker is never taken for a dead one.
    const everyMs = Math.min(5000, (this.ctx.config.JOB_STALE_SECONDS * 1000) / 4);
    const beat = setInterval(() => void heartbeat(db, job.id, this.workerId).catch(() => undefined), everyMs);
    let readable: { file: string; done(): Promise<void> } | null = null;
    try {
      const t0 = performance.now();
      readable = await readableOriginal(this.ctx, capture.originalPath ?? '');
      const result = await this.worker.ingest({ file: readable.file, sizeBytes: capture.sizeBytes, sampleRateHint: capture.sampleRateHint });
      const t1 = performance.now();
      if (!this.running) return;
      await this.store(job, result);
      if (process.env.CRESTLINE_TRACE) console.log(`capture ${capture.id}: read and analysed in ${(t1 - t0).toFixed(0)} ms, stored in ${(performance.now() - t1).toFixed(0)} ms`);
      const task = compressOriginal(this.ctx, capture.id).catch((err) => console.error('compressing original:', err));
      this.background.add(task);
      void task.finally(() => this.background.delete(task));
    } catch (err) {
      if (!this.running) return;
      if (err instanceof IngestFailure && err.code !== 'internal') await this.fail(job, err.code, err.message, err.line);
      else if (job.attempts >= MAX_ATTEMPTS) await this.fail(job, 'internal', `Processing failed ${job.attempts} times: ${(err as Error).message}`);
      else await db.update(jobs).set({ status: 'queued', lastError: describe(err) }).where(ownedBy(job.id, this.workerId));
    } finally {
      clearInterval(beat);
      await readable?.done();
    }
  }

  private async store(job: ClaimedJob, r: IngestResult): Promise<void> {
    await retryOnDeadlock(() => this.storeOnce(job, r));
  }

  private async storeOnce(job: ClaimedJob, r: IngestResult): Promise<void> {
    await this.ctx.db.transaction(async (tx) => {
      const [done] = await tx.update(jobs).set({ status: 'done', finishedAt: sql`NOW()` }).where(ownedBy(job.id, this.workerId));
      if (done.affectedRows !== 1) throw new Error(`job ${job.id} was taken over by another worker`);
      await clearStoredSamples(tx, job.captureId);
      for (const [idx, c] of r.channels.entries()) {
        await tx.insert(channels).values({ captureId: job.captureId, idx, name: c.name.slice(0, 120), unit: c.unit.slice(0, 20), invalidCount: c.invalidCount, analysis: c.analysis });
        let start = 0;
        for (const [chunkIdx, data] of c.chunks.entries()) {
          const buf = asBuffer(data);
          await tx.insert(sampleChunks).values({ captureId: job.captureId, channelIdx: idx, chunkIdx, startIndex: start, count: buf.length / 4, data: buf });
          start += buf.length / 4;
        }
        for (const o of c.overviews) await tx.insert(overviews).values({ captureId: job.captureId, channelIdx: idx, bucketSize: o.bucketSize, data: asBuffer(o.data) });
        if (c.suggestions.length) {
          await tx.insert(annotations).values(
            c.suggestions.map((a) => ({ captureId: job.captureId, channelIdx: idx, startS: a.startS, endS: a.endS, label: a.label, note: '', severity: a.severity, source: 'finder' as const, state: 'suggested' as const, reason: a.reason })),
          );
        }
      }
      await tx
        .update(captures)
        .set({
          status: 'ready',
          errorCode: null,
          errorMessage: null,
          errorLine: null,
          sampleRate: r.sampleRate,
          sampleCount: r.sampleCount,
          t0: r.t0,
          detected: r.detected,
          metadata: r.metadata,
          engineVersion: r.engineVersion,
          readyAt: sql`NOW()`,
        })
        .where(eq(captures.id, job.captureId));
    });
  }

  private async fail(job: ClaimedJob, code: string, message: string, line?: number): Promise<void> {
    await retryOnDeadlock(() => this.failOnce(job, code, message, line));
  }

  private async failOnce(job: ClaimedJob, code: string, message: string, line?: number): Promise<void> {
    await this.ctx.db.transaction(async (tx) => {
      const [owned] = await tx.update(jobs).set({ status: 'failed', lastError: message, finishedAt: sql`NOW()` }).where(ownedBy(job.id, this.workerId));
      if (owned.affectedRows !== 1) return;
      await clearStoredSamples(tx, job.captureId);
      await tx.update(captures).set({ status: 'failed', errorCode: code, errorMessage: message, errorLine: line ?? null }).where(eq(captures.id, job.captureId));
    });
  }
}
