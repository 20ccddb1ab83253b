import type { UploadStream } from '../workers/IngestWorkerPool';
import type { ClaimedJob } from './jobQueue';

/**
 * A slot is kept for an upload only this long, from its first byte until its capture is stored. A
 * slower one is dropped (it is read from disk once stored, as any queued capture), so a slow or
 * stalled client, even one that sends the file and then trickles the rest of the form, never holds a
 * processing slot.
 * Reading beside the upload pays on a fast link: a 27 MB file arrives over loopback in about 0.3 s and
 * takes about as long to read; over a slow link the reading after it is small beside the transfer.
 */
export const EARLY_READ_MAX_MS = 10_000;

/** How long a sender waits at most for a reading that fell behind to catch up (see push). */
export const CATCH_UP_MAX_MS = 2_000;

type State = 'reading' | 'arrived' | 'adopted' | 'dropped';

/**
 * A processing slot kept for one upload, whose CSV a worker reads while it streams in (the upload's
 * chunks are pushed to it). Once the upload is stored, its job is inserted already claimed by this
 * process (`claimant`) and processed on the slot (`adopt`) from the reading, without a second read of
 * the file. Whatever else happens (a duplicate, a refused form, a failed upload, a slow client), the
 * reading is dropped and the slot goes back to the queue.
 */
export class EarlyReading {
  private current: State = 'reading';
  private readonly timer: NodeJS.Timeout;

  constructor(
    private readonly workerId: string,
    private readonly stream: UploadStream,
    private readonly onAdopt: (job: ClaimedJob) => void,
    /** For a job inserted claimed whose reading was dropped meanwhile (the time ran out): it goes back to the queue. */
    private readonly onOrphan: (job: ClaimedJob) => void,
    private readonly release: () => void,
  ) {
    this.timer = setTimeout(() => this.drop(), EARLY_READ_MAX_MS);
    this.timer.unref();
  }

  /** Where the reading is: still arriving, arrived, taken over by its capture's job, or dropped. */
  get state(): State {
    return this.current;
  }

  /**
   * The next bytes of the file, in order. When the worker has fallen far behind (a fast sender on a
   * busy machine), a promise the sender waits on before its next bytes: the upload slows to the
   * reading's pace instead of the reading being dropped and the whole file read again from disk once
   * stored (the bench's 10 M-row file: read in 2.7 s after a 1.9 s upload). A reading that does not
   * catch up within CATCH_UP_MAX_MS is dropped and the upload goes on.
   */
  push(chunk: Uint8Array): Promise<void> | undefined {
    if (this.current !== 'reading') return;
    if (!this.stream.push(chunk)) return void this.drop();
    const caughtUp = this.stream.caughtUp();
    if (!caughtUp) return;
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<'late'>((resolve) => (timer = setTimeout(() => resolve('late'), CATCH_UP_MAX_MS)));
    return Promise.race([caughtUp, late]).then((outcome) => {
      clearTimeout(timer);
      if (outcome === 'late') this.drop();
    });
  }

  /** The whole file has arrived; the rest of the form and the storing of the capture follow. */
  arrived(): void {
    if (this.current !== 'reading') return;
    this.current = 'arrived';
  }

  /** The worker id the capture's job is to be inserted under, or null to queue it as usual. */
  claimant(): string | null {
    return this.current === 'arrived' ? this.workerId : null;
  }

  /**
   * The capture is stored and its job claimed by `claimant()`: process it from this reading, or, if the
   * reading was dropped after that answer (its time ran out during the storing), give the job back.
   */
  adopt(job: ClaimedJob): void {
    if (this.current !== 'arrived') return this.onOrphan(job);
    clearTimeout(this.timer);
    this.current = 'adopted';
    this.onAdopt(job);
  }

  /** Forgets the reading and frees the slot, unless a job took it over. Safe to call more than once. */
  drop(): void {
    if (this.current === 'adopted' || this.current === 'dropped') return;
    clearTimeout(this.timer);
    this.current = 'dropped';
    this.stream.drop();
    this.release();
  }
}
