import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { CATCH_UP_MAX_MS, EARLY_READ_MAX_MS, EarlyReading } from '../../server/jobs/earlyReading';
import type { UploadStream } from '../../server/workers/IngestWorkerPool';

/** The rules that keep an upload's reading from holding a processing slot longer than it pays. */
function reading(accepts = () => true, caughtUp: () => Promise<void> | null = () => null) {
  const pushed: number[] = [];
  const calls = { dropped: 0, released: 0, adopted: 0, orphaned: 0 };
  const stream: UploadStream = {
    push: (c) => (accepts() ? (pushed.push(c.length), true) : false),
    caughtUp,
    drop: () => void calls.dropped++,
    parse: () => Promise.reject(new Error('not used')),
  };
  const r = new EarlyReading('worker-1', stream, () => void calls.adopted++, () => void calls.orphaned++, () => void calls.released++);
  return { r, pushed, calls };
}

describe('the reading of an upload as it arrives', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('is dropped, and its slot released, when the upload takes longer than the limit', () => {
    const { r, calls } = reading();
    r.push(new Uint8Array(10));
    vi.advanceTimersByTime(EARLY_READ_MAX_MS + 1);
    expect(r.state).toBe('dropped');
    expect(calls).toMatchObject({ dropped: 1, released: 1 });
    r.arrived();
    expect(r.claimant()).toBeNull();
  });

  it('once arrived, names its worker as the claimant; adopted, it is no longer timed', () => {
    const { r, calls } = reading();
    r.arrived();
    expect(r.claimant()).toBe('worker-1');
    r.adopt({ id: 1, captureId: 2, kind: 'ingest', attempts: 1, owner: 'worker-1/0a1b2c3d' });
    vi.advanceTimersByTime(EARLY_READ_MAX_MS * 2);
    r.drop();
    expect(r.state).toBe('adopted');
    expect(calls).toMatchObject({ adopted: 1, dropped: 0, released: 0, orphaned: 0 });
  });

  it('keeps timing after the file has arrived: a sender that trickles the rest of the form loses the slot', () => {
    const { r, calls } = reading();
    r.arrived();
    vi.advanceTimersByTime(EARLY_READ_MAX_MS + 1);
    expect(r.state).toBe('dropped');
    expect(r.claimant()).toBeNull();
    expect(calls).toMatchObject({ dropped: 1, released: 1 });
  });

  it('gives up when its worker falls too far behind, and takes nothing after', () => {
    let room = 2;
    const { r, pushed, calls } = reading(() => room-- > 0);
    for (let i = 0; i < 5; i++) r.push(new Uint8Array(100));
    expect(pushed).toEqual([100, 100]);
    expect(r.state).toBe('dropped');
    expect(calls.released).toBe(1);
  });

  it('gives back a job inserted claimed if the reading was dropped meanwhile, rather than leave it unprocessed', () => {
    const { r, calls } = reading();
    r.arrived();
    expect(r.claimant()).toBe('worker-1');
    // the time runs out while the capture is being stored
    vi.advanceTimersByTime(EARLY_READ_MAX_MS + 1);
    r.adopt({ id: 1, captureId: 2, kind: 'ingest', attempts: 1, owner: 'worker-1/0a1b2c3d' });
    expect(calls).toMatchObject({ adopted: 0, orphaned: 1 });
  });

  it('has the sender wait while its worker is far behind, and go on once the worker has caught up', async () => {
    let catchUp = () => undefined as void;
    const behind = new Promise<void>((resolve) => (catchUp = resolve));
    const { r, pushed } = reading(undefined, () => behind);
    let waited = false;
    const wait = r.push(new Uint8Array(100));
    expect(wait).toBeInstanceOf(Promise);
    void wait!.then(() => (waited = true));
    await vi.advanceTimersByTimeAsync(CATCH_UP_MAX_MS / 2);
    expect(waited).toBe(false);
    catchUp();
    await vi.advanceTimersByTimeAsync(0);
    expect(waited).toBe(true);
    expect(r.state).toBe('reading');
    expect(pushed).toEqual([100]);
  });

  it('gives up a worker that does not catch up in time, and lets the upload go on without it', async () => {
    const { r, calls } = reading(undefined, () => new Promise<void>(() => undefined));
    const wait = r.push(new Uint8Array(100));
    await vi.advanceTimersByTimeAsync(CATCH_UP_MAX_MS + 1);
    await wait;
    expect(r.state).toBe('dropped');
    expect(calls).toMatchObject({ dropped: 1, released: 1 });
    expect(r.push(new Uint8Array(100))).toBeUndefined();
  });
});
