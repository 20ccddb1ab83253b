/** Samples per stored chunk: 4 MiB of Float32, well under MariaDB's max_allowed_packet of 64 MiB. */
export const CHUNK_SAMPLES = 1 << 20;

/** Overview bucket sizes: each level 8× coarser, down to a few thousand buckets. */
export const OVERVIEW_BASE = 64;
export const OVERVIEW_FACTOR = 8;

/**
 * Samples are stored as little-endian Float32: 24 bits of mantissa (7 significant digits) are more
 * than any 8- to 16-bit instrument converter resolves, and halve the storage of Float64. The figures
 * are computed from the Float64 values parsed from the file before this conversion.
 */
export function float32Chunks(samples: Float64Array): Buffer[] {
  const chunks: Buffer[] = [];
  for (let start = 0; start < samples.length; start += CHUNK_SAMPLES) {
    const part = new Float32Array(samples.subarray(start, Math.min(samples.length, start + CHUNK_SAMPLES)));
    chunks.push(Buffer.from(part.buffer, part.byteOffset, part.byteLength));
  }
  return chunks;
}

export interface OverviewLevel {
  bucketSize: number;
  /** (min, max) pairs, Float32; a bucket of invalid samples only holds NaN. */
  minMax: Float32Array;
}

/** The bucket sizes `overviewPyramid` builds for a record of n samples, finest first. */
export function overviewBucketSizes(n: number, stopAtBuckets = 2000): number[] {
  if (n <= OVERVIEW_BASE * 2) return [];
  const sizes = [OVERVIEW_BASE];
  let buckets = Math.ceil(n / OVERVIEW_BASE);
  while (buckets > stopAtBuckets) {
    buckets = Math.ceil(buckets / OVERVIEW_FACTOR);
    sizes.push(sizes[sizes.length - 1] * OVERVIEW_FACTOR);
  }
  return sizes;
}

/** The min/max pyramid that lets any zoom of a long record be drawn from a few thousand points. */
export function overviewPyramid(samples: Float64Array, stopAtBuckets = 2000): OverviewLevel[] {
  const levels: OverviewLevel[] = [];
  if (samples.length <= OVERVIEW_BASE * 2) return levels;
  let bucketSize = OVERVIEW_BASE;
  let buckets = Math.ceil(samples.length / bucketSize);
  let minMax = new Float32Array(buckets * 2);
  for (let b = 0; b < buckets; b++) {
    let lo = Infinity;
    let hi = -Infinity;
    const end = Math.min(samples.length, (b + 1) * bucketSize);
    for (let i = b * bucketSize; i < end; i++) {
      const v = samples[i];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    minMax[2 * b] = lo === Infinity ? NaN : lo;
    minMax[2 * b + 1] = hi === -Infinity ? NaN : hi;
  }
  levels.push({ bucketSize, minMax });
  while (buckets > stopAtBuckets) {
    const nextBuckets = Math.ceil(buckets / OVERVIEW_FACTOR);
    const next = new Float32Array(nextBuckets * 2);
    for (let b = 0; b < nextBuckets; b++) {
      let lo = Infinity;
      let hi = -Infinity;
      const end = Math.min(buckets, (b + 1) * OVERVIEW_FACTOR);
      for (let j = b * OVERVIEW_FACTOR; j < end; j++) {
        // Comparisons with NaN are false, so buckets of invalid samples only are skipped.
        if (minMax[2 * j] < lo) lo = minMax[2 * j];
        if (minMax[2 * j + 1] > hi) hi = minMax[2 * j + 1];
      }
      next[2 * b] = lo === Infinity ? NaN : lo;
      next[2 * b + 1] = hi === -Infinity ? NaN : hi;
    }
    bucketSize *= OVERVIEW_FACTOR;
    buckets = nextBuckets;
    minMax = next;
    levels.push({ bucketSize, minMax });
  }
  return levels;
}
