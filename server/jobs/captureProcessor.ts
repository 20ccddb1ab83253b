import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import { and, eq } from 'drizzle-orm';
import type { AppContext } from '../context';
import { findCaptureRow } from '../db/captureRepository';
import { isDatabaseAway } from '../errors';
import { captures, jobs } from '../db/schema';
import { compressOriginal, readableOriginal } from '../services/originalFiles';
import { IngestFailure, IngestWorkerPool, type UploadStream } from '../workers/IngestWorkerPool';
import { EarlyReading } from './earlyReading';
import type { IngestRequest } from '../workers/ingestTask';
import { maxSamples, taskBudgetMs } from './ingestLimits';
import { claimJob, enqueue, heartbeat, MAX_ATTEMPTS, ownedBy, releaseJob, type ClaimedJob } from './jobQueue';
import { unexpectedFailure } from './processingFailure';
import { runSetupOf } from './runSetup';
import { storeFailure, storeReady, storeSamples } from './storeOutcome';

const POLL_MS = 500;
/** How often waiting housekeeping looks whether the slots have gone quiet. */
const COMPRESS_WAIT_MS = 200;
/** Compression starts only after the slots have been idle this long, so a burst of uploads goes first. */
const QUIET_BEFORE_COMPRESS_MS = 2000;
/** Longest pause between polls while the database cannot be reached. */
const MAX_BACKOFF_MS = 10_000;

/**
 * Takes capture jobs from the shared queue, INGEST_CONCURRENCY at a time, each in worker threads of its
 * own slot, and stores the outcome in one transaction: a capture becomes ready with all its samples and
 * analysis, or failed with a short message and no samples. A file that runs past its time budget has
 * its worker stopped and fails alone, while the other slot keeps serving the team's uploads. A write
 * whose job was meanwhile taken over by another process (after a missed heartbeat) is rolled back, so
 * each capture is processed exactly once.
 */
export class CaptureProcessor {
  readonly workerId = `${hostname().slice(0, 40)}:${process.pid}:${randomBytes(3).toString('hex')}`;
  /** One worker pool per slot: stopping a stuck file's worker never touches another file's task. */
  readonly slots: IngestWorkerPool[];
  private running = false;
  /** On a deliberate stop, interrupted jobs go back to the queue; an abandon leaves them as a crash would. */
  private releaseOnStop = true;
  private wakers = new Set<() => void>();
  /** Slots whose loop is pausing for want of work: an upload may take one that is not held (readUpload). */
  private pausing = new Set<IngestWorkerPool>();
  /** Slots kept for an upload, with what their loop waits for before it claims again. */
  private held = new Map<IngestWorkerPool, Promise<void>>();
  private readings = new Set<EarlyReading>();
  /** Captures whose kept originals wait to be compressed (compressLater). */
  private toCompress: number[] = [];
  private compressing = false;
  /** When a slot last started or finished work, or an upload was last taken (performance.now()). */
  private lastActivity = 0;
  /** When each slot last finished a job (performance.now()). */
  private lastWorked = new Map<IngestWorkerPool, number>();
  private loops: Promise<void>[] = [];
  private background = new Set<Promise<unknown>>();

  constructor(private readonly ctx: AppContext) {
    this.slots = Array.from({ length: ctx.config.INGEST_CONCURRENCY }, () => new IngestWorkerPool(ctx.config.INGEST_WORKERS));
  }

  start(): void {
    if (this.running) return;
    this.running = true;
    this.releaseOnStop = true;
    for (const slot of this.slots) slot.warm();
    this.loops = this.slots.map((slot) => this.run(slot));
  }

  /** Looks at the queue now rather than at the next poll (after an upload). */
  nudge(): void {
    for (const wake of [...this.wakers]) wake();
  }

  /**
   * Stops promptly: running tasks are interrupted and their jobs given back to the queue uncounted,
   * so a shutdown never waits for a large file. Waits for background work (compression).
   */
  async stop(): Promise<void> {
    this.running = false;
    this.dropReadings();
    this.nudge();
    await Promise.all(this.slots.map((s) => s.close()));
    await Promise.all(this.loops);
    await Promise.allSettled([...this.background]);
  }

  /** Stops at once, leaving a running job unfinished and owned, as a killed process would. */
  async abandon(): Promise<void> {
    this.running = false;
    this.releaseOnStop = false;
    this.dropReadings();
    this.nudge();
    await Promise.all(this.slots.map((s) => s.close()));
    await Promise.all(this.loops.map((l) => l.catch(() => undefined)));
  }

  /**
   * Keeps an idle slot for an upload of about `expectedBytes` and has its worker read the CSV while it
   * arrives (see EarlyReading); null when no slot is idle. With several slots, uploads still arriving
   * hold all but one at most, so slow senders cannot keep the queue waiting. (A slot whose upload has
   * arrived is processing it, as a slot processes a claimed job, and claims from the queue when done.)
   */
  readUpload(expectedBytes: number): EarlyReading | null {
    const arriving = [...this.readings].filter((r) => r.state === 'reading' || r.state === 'arrived').length;
    if (!this.running || arriving >= Math.max(1, this.slots.length - 1)) return null;
    // The slot that worked last: V8 optimises the reading and the analysis over several runs in each
    // worker thread (a 1 M-sample channel took 300 ms on its first runs and 70 ms from about the sixth),
    // so uploads one after another keep to the threads already warm instead of alternating.
    const [slot] = [...this.pausing].filter((s) => !this.held.has(s)).sort((a, b) => (this.lastWorked.get(b) ?? 0) - (this.lastWorked.get(a) ?? 0));
    if (!slot) return null;
    this.lastActivity = performance.now();
    let free = () => undefined as void;
    this.held.set(slot, new Promise<void>((resolve) => (free = resolve)));
    const stream = slot.openStream({ totalBytes: expectedBytes, limits: { maxSamples: maxSamples(this.ctx.config) } });
    const reading: EarlyReading = new EarlyReading(
      this.workerId,
      stream,
      (job) => this.inBackground(this.process(job, slot, stream).catch((err) => console.error('capture processing:', err)).finally(release)),
      (job) => this.inBackground(this.giveBack(job).then(() => this.nudge(), (err) => console.error('capture processing:', err))),
      () => release(),
    );
    const release = () => {
      this.readings.delete(reading);
      this.held.delete(slot);
      free();
    };
    this.readings.add(reading);
    return reading;
  }

  private dropReadings(): void {
    for (const r of [...this.readings]) r.drop();
  }

  private async run(slot: IngestWorkerPool): Promise<void> {
    let pauseMs = POLL_MS;
    while (this.running) {
      const held = this.held.get(slot);
      if (held) {
        await held;
        continue;
      }
      let job: ClaimedJob | null = null;
      try {
        job = await claimJob(this.ctx.db, this.workerId, this.ctx.config.JOB_STALE_SECONDS);
        if (job) await this.process(job, slot);
        pauseMs = POLL_MS;
      } catch (err) {
        // Most often the database is away: ask less often until it answers again.
        pauseMs = Math.min(pauseMs * 2, MAX_BACKOFF_MS);
        if (this.running) {
          if (isDatabaseAway(err)) console.error(`capture processing: the database cannot be reached; next try in ${pauseMs / 1000} s`);
          else console.error('capture processing:', err);
        }
        job = null;
      }
      if (!job && this.running) {
        this.pausing.add(slot);
        await this.pause(pauseMs);
        this.pausing.delete(slot);
      }
    }
  }

  private pause(ms: number): Promise<void> {
    return new Promise<void>((resolve) => {
      const wake = () => {
        clearTimeout(t);
        this.wakers.delete(wake);
        resolve();
      };
      const t = setTimeout(wake, ms);
      this.wakers.add(wake);
    });
  }

  /** Processes a claimed job on `slot`: from the file, or from the reading of its upload (`stream`). */
  private async process(job: ClaimedJob, slot: IngestWorkerPool, stream?: UploadStream): Promise<void> {
    this.lastActivity = performance.now();
    try {
      await this.processClaimed(job, slot, stream);
    } finally {
      this.lastActivity = performance.now();
      this.lastWorked.set(slot, this.lastActivity);
    }
  }

  private async processClaimed(job: ClaimedJob, slot: IngestWorkerPool, stream?: UploadStream): Promise<void> {
    const { db, config } = this.ctx;
    const capture = await findCaptureRow(db, job.captureId);
    if (!capture) return;
    if (job.attempts > MAX_ATTEMPTS) {
      const message = unexpectedFailure(capture.id, `job ${job.id} was claimed ${job.attempts} times without finishing`, 'processing stopped without finishing several times');
      await storeFailure(db, job, { code: 'internal', message });
      return;
    }
    // A re-analysis leaves the capture readable, with its current results, until the new ones are stored.
    if (job.kind === 'ingest') await db.update(captures).set({ status: 'processing' }).where(eq(captures.id, capture.id));
    // Four heartbeats per stale period, so a live worker is never taken for a dead one.
    const everyMs = Math.min(5000, (config.JOB_STALE_SECONDS * 1000) / 4);
    const beat = setInterval(() => void heartbeat(db, job).catch(() => undefined), everyMs);
    let readable: Awaited<ReturnType<typeof readableOriginal>> | null = null;
    try {
      const t0 = performance.now();
      // An upload read as it arrived needs no copy of the file.
      readable = stream ? null : await readableOriginal(this.ctx, capture.id);
      const setup = await runSetupOf(this.ctx.db, capture);
      const request: IngestRequest = { file: readable?.file ?? '', sizeBytes: capture.sizeBytes, sampleRateHint: capture.sampleRateHint, limits: { maxSamples: maxSamples(config) }, ...setup };
      if (capture.format === 'comtrade') request.comtrade = { dataFile: readable?.dataFile ?? null, configName: capture.originalName, dataName: capture.dataName, values: capture.comtradeValues ?? 'primary' };
      const budgetMs = taskBudgetMs(config, capture.sizeBytes);
      const parsed = await slot.read(request, budgetMs, stream);
      const t1 = performance.now();
      if (!this.running) return await this.giveBack(job);
      // An ingest's samples are stored while its channels are analysed (storeSamples says why). Both are
      // awaited before anything else: a failure must not clear samples still being written.
      const early = job.kind === 'ingest' ? storeSamples(db, job, parsed.stored) : null;
      const [analysed, samplesStored] = await Promise.allSettled([slot.analyse(parsed, request, budgetMs), early]);
      if (analysed.status === 'rejected') throw analysed.reason;
      if (samplesStored.status === 'rejected') throw samplesStored.reason;
      if (!this.running) return await this.giveBack(job);
      await storeReady(db, job, early ? null : parsed.stored, analysed.value);
      // A setup changed while this run used the old one: its own request was folded into this job, so run again.
      const now = await findCaptureRow(db, capture.id);
      if (now && JSON.stringify(await runSetupOf(this.ctx.db, now)) !== JSON.stringify(setup) && (await enqueue(db, capture.id, 'reanalyse'))) this.nudge();
      if (process.env.CRESTLINE_TRACE) console.log(`capture ${capture.id}: read in ${(t1 - t0).toFixed(0)} ms, then analysed and stored in ${(performance.now() - t1).toFixed(0)} ms`);
      this.compressLater(capture.id);
    } catch (err) {
      if (!this.running) return await this.giveBack(job);
      if (err instanceof IngestFailure && err.code !== 'internal') {
        await storeFailure(db, job, { code: err.code, message: err.message, line: err.line });
      } else if (job.attempts >= MAX_ATTEMPTS) {
        await storeFailure(db, job, { code: 'internal', message: unexpectedFailure(capture.id, err) });
      } else {
        // Worth another try (a worker that died, a lost connection); the details go to the log only.
        const note = unexpectedFailure(capture.id, err, `attempt ${job.attempts} failed`);
        await db.update(jobs).set({ status: 'queued', lastError: note }).where(ownedBy(job));
      }
    } finally {
      clearInterval(beat);
      await readable?.done();
    }
  }

  private async giveBack(job: ClaimedJob): Promise<void> {
    if (!this.releaseOnStop) return;
    await releaseJob(this.ctx.db, job);
    if (job.kind === 'ingest') await this.ctx.db.update(captures).set({ status: 'queued' }).where(and(eq(captures.id, job.captureId), eq(captures.status, 'processing')));
  }

  /**
   * Compression of kept originals is housekeeping: it waits until no slot has read or analysed for a
   * moment (QUIET_BEFORE_COMPRESS_MS). On two cores, gzip of the previous 27 MB CSV (1.2 s of CPU at
   * level 6, 0.33 s at today's level 1) beside the next upload made that upload's analysis about
   * twice as slow. Originals left when the process stops stay plain
   * (they read the same).
   */
  private compressLater(captureId: number): void {
    this.toCompress.push(captureId);
    if (this.compressing) return;
    this.compressing = true;
    this.inBackground(
      (async () => {
        while (this.running && this.toCompress.length) {
          if (this.held.size > 0 || this.slots.some((s) => !this.pausing.has(s)) || performance.now() - this.lastActivity < QUIET_BEFORE_COMPRESS_MS) {
            await new Promise((r) => setTimeout(r, COMPRESS_WAIT_MS));
            continue;
          }
          const id = this.toCompress.shift()!;
          await compressOriginal(this.ctx, id).catch((err) => console.error(`compressing the original of capture ${id}:`, err));
        }
        this.compressing = false;
      })(),
    );
  }

  private inBackground(task: Promise<unknown>): void {
    this.background.add(task);
    void task.finally(() => this.background.delete(task));
  }
}
