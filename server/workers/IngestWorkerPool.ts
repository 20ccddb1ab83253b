import { ENGINE_VERSION } from '../../shared/analysis';
import { Worker } from 'node:worker_threads';
import type { ValidSpanResult } from '../../shared/analysis';
import type { AnalyseRequest, IngestedChannel, IngestRequest, IngestResult, ParsedFile, ReadCapture, SpanFiguresRequest } from './ingestTask';
import type { IngestReply, IngestTask } from './ingestWorker';
import type { StreamMessage, StreamOpenOptions, StreamParseRequest, StreamProgress } from './uploadReading';

/** A capture the worker could not read or analyse: a user-facing message, with the file line when known. */
export class IngestFailure extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly line?: number,
  ) {
    super(message);
  }
}

/** An upload being read by a worker while it arrives (see IngestWorkerPool.openStream). */
export interface UploadStream {
  /** Hands the next bytes on; false when the worker is too far behind to take more (drop the stream). */
  push(chunk: Uint8Array): boolean;
  /**
   * Null while the worker keeps up; once it is UNREAD_HIGH_BYTES behind, a promise that settles when it
   * is back within UNREAD_LOW_BYTES (or the stream is dropped): the sender waits for it.
   */
  caughtUp(): Promise<void> | null;
  /** Forgets the reading (the upload failed, was a duplicate, or took too long to arrive). */
  drop(): void;
  parse(request: Omit<StreamParseRequest, 'stream'>, budgetMs: number): Promise<ReadCapture>;
}

/** An upload arriving faster than its worker reads it may run this far ahead; then the reading is dropped. */
const MAX_UNREAD_STREAM_BYTES = 64 * 1024 * 1024;
/** Past this many unread bytes the sender is asked to wait (caughtUp), until the worker is within UNREAD_LOW_BYTES. */
const UNREAD_HIGH_BYTES = 32 * 1024 * 1024;
const UNREAD_LOW_BYTES = 8 * 1024 * 1024;

interface PooledWorker {
  worker: Worker;
  busy: number;
  /** Settles when the thread has loaded its code (about 0.4 s): budgets count from then. */
  ready: Promise<void>;
}

/**
 * Long-lived worker threads for parsing and analysis, so the API stays responsive while a large file
 * is processed. Starting a worker costs about 0.4 s here (tsx compiles the sources), so they are kept.
 * A file is read by one worker; its channels are then analysed as separate tasks, spread over the pool.
 * Two workers by default, one per core here: two threads do twice the work of one in 1.05 times the
 * time on this machine, and a 2-channel capture's analysis runs side by side. (An earlier measurement
 * that showed no gain was taken while parallel test suites loaded both cores.)
 *
 * Every task has a time budget: a worker still busy when it runs out is terminated (V8 stops even a
 * tight loop or a backtracking regular expression), the task fails with `timeout`, and the next task
 * gets a fresh worker. Each job slot of the processor owns its own pool, so killing one file's
 * worker never touches another file's task.
 */
export class IngestWorkerPool {
  private workers: PooledWorker[] = [];
  private nextId = 1;
  private nextStream = 1;
  /**
   * Each open upload stream: the bytes sent to its worker, those the worker has read (it reports every
   * few MiB), and the sender waiting for it to catch up, if any.
   */
  private streams = new Map<number, { sent: number; consumed: number; wake: (() => void) | null }>();
  private pending = new Map<number, { resolve: (r: unknown) => void; reject: (e: Error) => void; owner: PooledWorker }>();

  constructor(private readonly size = 1) {}

  /** Tasks handed to the worker threads and not yet answered. */
  get tasksInFlight(): number {
    return this.pending.size;
  }

  /** Starts the workers ahead of the first task, so its budget is not spent compiling. */
  warm(): void {
    while (this.workers.length < this.size) this.workers.push(this.spawn());
  }

  private spawn(): PooledWorker {
    const worker = new Worker(new URL('./bootstrap.mjs', import.meta.url), {
      workerData: { entry: new URL('./ingestWorker.ts', import.meta.url).href },
      resourceLimits: { maxOldGenerationSizeMb: 4096 },
    });
    let markReady = () => undefined as void;
    const pooled: PooledWorker = { busy: 0, worker, ready: new Promise<void>((resolve) => (markReady = resolve)) };
    pooled.worker.on('message', (reply: IngestReply | { ready: true } | StreamProgress) => {
      if ('ready' in reply) return markReady();
      if ('consumed' in reply) {
        // A report that arrives after its stream was finished or dropped finds nothing to update.
        const open = this.streams.get(reply.stream);
        if (!open) return;
        open.consumed = reply.consumed;
        if (open.sent - open.consumed <= UNREAD_LOW_BYTES) this.wakeSender(reply.stream);
        return;
      }
      const p = this.pending.get(reply.id);
      if (!p) return;
      this.pending.delete(reply.id);
      pooled.busy--;
      if (reply.ok) p.resolve(reply.result);
      else p.reject(new IngestFailure(reply.error.code, reply.error.message, reply.error.line));
    });
    const fail = (err: Error) => {
      this.workers = this.workers.filter((w) => w !== pooled);
      for (const [id, p] of this.pending) {
        if (p.owner !== pooled) continue;
        this.pending.delete(id);
        p.reject(err);
      }
    };
    pooled.worker.on('error', fail);
    pooled.worker.on('exit', (code) => {
      markReady();
      fail(new Error(`An ingest worker stopped (exit code ${code})`));
    });
    pooled.worker.unref();
    return pooled;
  }

  private wakeSender(stream: number): void {
    const open = this.streams.get(stream);
    open?.wake?.();
    if (open) open.wake = null;
  }

  /** Forgets a stream (finished or dropped); a sender still waiting on it goes on. */
  private closeStream(stream: number): void {
    this.wakeSender(stream);
    this.streams.delete(stream);
  }

  private leastBusy(): PooledWorker {
    this.warm();
    return this.workers.reduce((a, b) => (b.busy < a.busy ? b : a));
  }

  private run<T>(task: IngestTask, budgetMs: number, transfer: ArrayBuffer[] = [], pooled = this.leastBusy()): Promise<T> {
    const id = this.nextId++;
    pooled.busy++;
    return new Promise<T>((resolve, reject) => {
      let timer: NodeJS.Timeout | undefined;
      const overBudget = () => {
        if (!this.pending.has(id)) return;
        this.pending.delete(id);
        reject(new IngestFailure('timeout', `Processing took longer than ${formatSeconds(budgetMs / 1000)}, the time allowed for a file of this size, and was stopped.`));
        // Other tasks on this worker (the same file's channels) are rejected by its exit.
        this.workers = this.workers.filter((w) => w !== pooled);
        void pooled.worker.terminate();
      };
      void pooled.ready.then(() => {
        if (this.pending.has(id)) timer = setTimeout(overBudget, budgetMs);
      });
      const settle =
        <A>(f: (a: A) => void) =>
        (a: A) => {
          clearTimeout(timer);
          f(a);
        };
      this.pending.set(id, { resolve: settle(resolve as (r: unknown) => void), reject: settle(reject), owner: pooled });
      pooled.worker.postMessage({ id, task }, transfer);
    });
  }

  /**
   * Opens a CSV reading on one worker, fed with the bytes of an upload as they arrive, so that the
   * file is read while it is still being sent: `read` then finishes it instead of reading the file.
   */
  openStream(options: StreamOpenOptions): UploadStream {
    const pooled = this.leastBusy();
    const stream = this.nextStream++;
    const post = (m: StreamMessage, transfer: ArrayBuffer[] = []) => {
      if (this.workers.includes(pooled)) pooled.worker.postMessage(m, transfer);
    };
    const open = { sent: 0, consumed: 0, wake: null as (() => void) | null };
    this.streams.set(stream, open);
    post({ stream, open: options });
    return {
      push: (chunk) => {
        // The bytes waiting for the worker are memory on top of the samples: past the bound, the
        // reading gives up (the file is read from disk once stored) rather than queue without end.
        if (open.sent - open.consumed > MAX_UNREAD_STREAM_BYTES) return false;
        // A copy the worker can own: the upload's chunk may share its memory with other data.
        const copy = new Uint8Array(chunk);
        // Counted before the transfer, which leaves `copy` empty.
        open.sent += copy.length;
        post({ stream, chunk: copy }, [copy.buffer]);
        return true;
      },
      caughtUp: () => {
        if (open.sent - open.consumed <= UNREAD_HIGH_BYTES) return null;
        return new Promise<void>((resolve) => {
          this.wakeSender(stream);
          open.wake = resolve;
        });
      },
      drop: () => {
        this.closeStream(stream);
        post({ stream, drop: true });
      },
      parse: (request, budgetMs) => {
        this.closeStream(stream);
        return this.run<ReadCapture>({ kind: 'streamParse', request: { ...request, stream } }, budgetMs, [], pooled);
      },
    };
  }

  /**
   * Reads a capture file, or finishes the reading of its upload (`stream`), within `budgetMs`: the
   * samples in Float64 for the analysis (which takes them over), and packed as stored (Float32 chunks),
   * which stay here for the store.
   */
  read(request: IngestRequest, budgetMs: number, stream?: UploadStream): Promise<ReadCapture> {
    return stream
      ? stream.parse({ sampleRateHint: request.sampleRateHint, channelSetup: request.channelSetup, systems: request.systems }, budgetMs)
      : this.run<ReadCapture>({ kind: 'parse', request }, budgetMs);
  }

  /** Analyses a read capture's channels in parallel, each task within `budgetMs`. Takes over their samples. */
  async analyse(parsed: ParsedFile, request: Pick<IngestRequest, 'declared'>, budgetMs: number): Promise<IngestResult> {
    const channels = await Promise.all(
      parsed.channels.map((channel) => {
        const analyse: AnalyseRequest = { channel, sampleRate: parsed.sampleRate, t0: parsed.t0, declared: request.declared ?? null };
        return this.run<IngestedChannel>({ kind: 'analyse', request: analyse }, budgetMs, [channel.samples.buffer as ArrayBuffer]);
      }),
    );
    const { sampleRate, sampleCount, t0, detected, metadata, systems, comtrade, marks } = parsed;
    return { sampleRate, sampleCount, t0, detected, metadata, engineVersion: ENGINE_VERSION, channels, systems, comtrade, marks };
  }

  /** The engine's figures over spans of stored samples, off the event loop, within `budgetMs`. */
  spanFigures(request: SpanFiguresRequest, budgetMs: number): Promise<ValidSpanResult[]> {
    return this.run<ValidSpanResult[]>({ kind: 'figures', request }, budgetMs, request.channels.map((c) => c.buffer as ArrayBuffer));
  }

  /** Terminates every worker; their unfinished tasks are rejected. The next task starts fresh ones. */
  async close(): Promise<void> {
    const all = this.workers;
    this.workers = [];
    await Promise.all(all.map((w) => w.worker.terminate()));
  }
}

const formatSeconds = (s: number) => (s >= 10 ? `${Math.round(s)} s` : `${Number(s.toPrecision(2))} s`);
