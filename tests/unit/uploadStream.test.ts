import { afterAll, describe, expect, it } from 'vitest';
import { IngestWorkerPool } from '../../server/workers/IngestWorkerPool';

/** The flow control between an upload and the worker thread that reads it as it arrives. */
describe('the reading of an upload in a worker thread', () => {
  const pool = new IngestWorkerPool(1);
  afterAll(() => pool.close());

  it('asks the sender to wait once it is far ahead of the worker, and lets it go on once the worker caught up', async () => {
    // Over 32 MiB of a 1 kS/s, 2-column CSV (13 bytes a row), pushed faster than any reader takes it.
    const header = new TextEncoder().encode('Time (s),CH1 (V)\n');
    const ROWS = 80_000;
    const block = (k: number) => new TextEncoder().encode(Array.from({ length: ROWS }, (_, i) => `${((k * ROWS + i) / 1000).toFixed(3).padStart(8, '0')},1.5\n`).join(''));
    const BLOCK_BYTES = block(0).length;
    const stream = pool.openStream({ totalBytes: header.length + 40 * BLOCK_BYTES, limits: { maxSamples: 1e8 } });
    expect(stream.push(header)).toBe(true);
    expect(stream.caughtUp()).toBeNull();
    let blocks = 0;
    while (blocks * BLOCK_BYTES <= 32 * 1024 * 1024) expect(stream.push(block(blocks++))).toBe(true);
    const wait = stream.caughtUp();
    expect(wait).toBeInstanceOf(Promise);
    await wait;
    // The worker has read all but a few MiB of what was sent; the reading itself goes on undisturbed.
    expect(stream.caughtUp()).toBeNull();
    const read = await stream.parse({ sampleRateHint: null }, 60_000);
    expect(read.channels[0].samples.length).toBe(blocks * ROWS);
  }, 30_000);
});
