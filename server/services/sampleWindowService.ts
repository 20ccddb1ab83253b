import { and, eq, sql } from 'drizzle-orm';
import type { SamplesQuery, SamplesResponse } from '../../shared/schemas/capture';
import type { AppContext } from '../context';
import { captures, channels, overviews, sampleChunks } from '../db/schema';
import { CHUNK_SAMPLES, overviewBucketSizes } from './samplePacking';
import { AppError, notFound } from '../errors';
import { samplesToJson, type SampleWindowData } from '../../shared/samples/samplesBinary';

const toFloat32 = (b: Buffer) => new Float32Array(b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength));

/**
 * Samples [start, start+count) of a channel. Chunk k holds samples [k·CHUNK_SAMPLES, (k+1)·CHUNK_SAMPLES),
 * so the chunks needed follow by arithmetic, and only their needed bytes are read.
 */
export async function readSamples(ctx: AppContext, captureId: number, channel: number, start: number, count: number): Promise<Float32Array> {
  const out = new Float32Array(count);
  const first = Math.floor(start / CHUNK_SAMPLES);
  const last = Math.floor((start + count - 1) / CHUNK_SAMPLES);
  for (let k = first; k <= last; k++) {
    const from = Math.max(start, k * CHUNK_SAMPLES);
    const to = Math.min(start + count, (k + 1) * CHUNK_SAMPLES);
    const [row] = await ctx.db
      .select({ bytes: sql<Buffer>`SUBSTRING(${sampleChunks.data}, ${(from - k * CHUNK_SAMPLES) * 4 + 1}, ${(to - from) * 4})` })
      .from(sampleChunks)
      .where(and(eq(sampleChunks.captureId, captureId), eq(sampleChunks.channelIdx, channel), eq(sampleChunks.chunkIdx, k)));
    if (row) out.set(toFloat32(row.bytes), from - start);
  }
  return out;
}

/** Min and max of consecutive groups of `group` (min, max) pairs; NaN-only groups stay NaN. */
function mergeBuckets(pairs: Float32Array, group: number): { min: Float32Array; max: Float32Array } {
  const n = pairs.length / 2;
  const buckets = Math.ceil(n / group);
  const min = new Float32Array(buckets);
  const max = new Float32Array(buckets);
  for (let g = 0, k = 0; g < n; g += group, k++) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let j = g; j < Math.min(n, g + group); j++) {
      if (pairs[2 * j] < lo) lo = pairs[2 * j];
      if (pairs[2 * j + 1] > hi) hi = pairs[2 * j + 1];
    }
    min[k] = lo === Infinity ? NaN : lo;
    max[k] = hi === -Infinity ? NaN : hi;
  }
  return { min, max };
}

/**
 * A span of one channel at the resolution of the screen: the samples themselves when there are no more
 * than `points`, else min/max per bucket from the stored pyramid (or from the samples, for spans too
 * short for the finest level), so a 10-million-sample capture answers as fast as a small one. Typed
 * arrays: the route sends them as JSON or as binary (samplesBinary.ts), as the client asks.
 */
export async function sampleWindowData(ctx: AppContext, captureId: number, q: SamplesQuery): Promise<SampleWindowData> {
  // One query for the capture and the channel: this endpoint answers every zoom step.
  const [capture] = await ctx.db
    .select({ status: captures.status, sampleCount: captures.sampleCount, sampleRate: captures.sampleRate, t0: captures.t0, channel: channels.idx })
    .from(captures)
    .leftJoin(channels, and(eq(channels.captureId, captures.id), eq(channels.idx, q.channel)))
    .where(eq(captures.id, captureId));
  if (!capture) throw notFound('Capture');
  if (capture.status !== 'ready') throw new AppError(409, 'not_ready', `The capture is ${capture.status}; its samples are not ready yet`);
  if (capture.channel === null) throw notFound(`Channel ${q.channel}`);
  const n = capture.sampleCount ?? 0;
  const dt = 1 / (capture.sampleRate ?? 1);
  const t0 = capture.t0 ?? 0;
  const i0 = Math.min(n, Math.max(0, q.fromS === undefined ? 0 : Math.floor((q.fromS - t0) / dt)));
  const i1 = Math.min(n, Math.max(i0, q.toS === undefined ? n : Math.ceil((q.toS - t0) / dt) + 1));
  const count = i1 - i0;
  const base = { channel: q.channel, startIndex: i0, sampleCount: count };
  if (count <= q.points) {
    return { ...base, mode: 'raw', t0S: t0 + i0 * dt, stepS: dt, values: await readSamples(ctx, captureId, q.channel, i0, count) };
  }
  const perPoint = count / q.points;
  const bucket = overviewBucketSizes(n).filter((b) => b <= perPoint).pop();
  if (bucket === undefined) {
    const group = Math.ceil(perPoint);
    const samples = await readSamples(ctx, captureId, q.channel, i0, count);
    const pairs = new Float32Array(count * 2);
    for (let i = 0; i < count; i++) pairs[2 * i] = pairs[2 * i + 1] = samples[i];
    return { ...base, mode: 'minmax', t0S: t0 + i0 * dt, stepS: group * dt, ...mergeBuckets(pairs, group) };
  }
  const b0 = Math.floor(i0 / bucket);
  const b1 = Math.ceil(i1 / bucket);
  const [row] = await ctx.db
    .select({ bytes: sql<Buffer>`SUBSTRING(${overviews.data}, ${b0 * 8 + 1}, ${(b1 - b0) * 8})` })
    .from(overviews)
    .where(and(eq(overviews.captureId, captureId), eq(overviews.channelIdx, q.channel), eq(overviews.bucketSize, bucket)));
  const group = Math.ceil((b1 - b0) / q.points);
  return { ...base, startIndex: b0 * bucket, mode: 'minmax', t0S: t0 + b0 * bucket * dt, stepS: group * bucket * dt, ...mergeBuckets(toFloat32(row.bytes), group) };
}

/** The JSON answer of `sampleWindowData`, for clients that do not ask for binary. */
export async function sampleWindow(ctx: AppContext, captureId: number, q: SamplesQuery): Promise<SamplesResponse> {
  return samplesToJson(await sampleWindowData(ctx, captureId, q));
}
