/** Storage format: Float32 chunks round-trip the samples to Float32 precision; the min/max pyramid bounds every bucket (common practice, no source). */
import { describe, expect, it } from 'vitest';
import { CHUNK_SAMPLES, float32Chunks, overviewBucketSizes, overviewPyramid } from '../../server/services/samplePacking';

describe('float32Chunks', () => {
  it('splits into chunks of 2^20 samples, little-endian Float32', () => {
    const x = Float64Array.from({ length: CHUNK_SAMPLES + 10 }, (_, i) => Math.sin(i) * 325.27);
    const chunks = float32Chunks(x);
    expect(chunks.map((c) => c.length / 4)).toEqual([CHUNK_SAMPLES, 10]);
    expect(chunks[1].readFloatLE(4 * 3)).toBe(Math.fround(x[CHUNK_SAMPLES + 3]));
  });
});

describe('overviewPyramid', () => {
  it('each level holds the min and max of its buckets, skipping invalid samples', () => {
    const x = Float64Array.from({ length: 600_000 }, (_, i) => Math.sin(i / 100));
    x.fill(NaN, 0, 4096); // the first top-level buckets hold invalid samples only
    x[123_456] = 5;
    const levels = overviewPyramid(x);
    expect(levels.map((l) => l.bucketSize)).toEqual(overviewBucketSizes(x.length));
    for (const { bucketSize, minMax } of levels) {
      const b = Math.floor(123_456 / bucketSize);
      expect(minMax[2 * b + 1]).toBe(5);
      expect(Number.isNaN(minMax[0])).toBe(bucketSize <= 4096);
    }
    expect(levels[levels.length - 1].minMax.length / 2).toBeLessThanOrEqual(2000);
  });
});
