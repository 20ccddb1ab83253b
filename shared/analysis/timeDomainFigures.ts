import type { Samples } from './samples';

/** Amplitude figures of a span of samples, all in the channel's unit. */
export interface TimeDomainFigures {
  mean: number;
  rms: number;
  acRms: number;
  rectifiedAverage: number;
  acRectifiedAverage: number;
  peak: number;
  min: number;
  max: number;
  peakToPeak: number;
  /** max |x − mean|: the AC peak seen by an AC-coupled peak detector. */
  acPeak: number;
  crestFactor: number | null;
  formFactor: number | null;
}

/**
 * Mean, true RMS (AC+DC and AC part), rectified averages, extremes, crest and form factor of
 * `x[start .. start+count)`.
 *
 * Two passes: the first gathers Σx, Σx², Σ|x|, min and max; the second Σ|x − mean| and Σ(x − mean)².
 * The AC RMS comes from the second sum rather than from rms² − mean², which would cancel
 * catastrophically for a small ripple on a large DC level (and could go negative).
 *
 * Both loops run four independent accumulators: measured here on 10 M samples, about 280 M samples/s
 * against 100–145 M/s for the plain single-accumulator loops (`npm run bench` prints both), because
 * the additions no longer wait on each other. NaN samples are not expected here (callers analyse
 * valid stretches only); Math.min would propagate one.
 */
export function timeDomainFigures(x: Samples, start = 0, count = x.length - start): TimeDomainFigures {
  if (count <= 0 || start < 0 || start + count > x.length) {
    throw new RangeError(`timeDomainFigures: span ${start}+${count} is outside a record of ${x.length} samples`);
  }
  const end = start + count;
  const unrolledEnd = start + (count - (count % 4));
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let q0 = 0, q1 = 0, q2 = 0, q3 = 0;
  let a0 = 0, a1 = 0, a2 = 0, a3 = 0;
  // Two independent extreme chains, like the sums: 280 M samples/s here against 200 M/s with one.
  let lo0 = Infinity, lo1 = Infinity;
  let hi0 = -Infinity, hi1 = -Infinity;
  for (let i = start; i < unrolledEnd; i += 4) {
    const v0 = x[i], v1 = x[i + 1], v2 = x[i + 2], v3 = x[i + 3];
    s0 += v0; s1 += v1; s2 += v2; s3 += v3;
    q0 += v0 * v0; q1 += v1 * v1; q2 += v2 * v2; q3 += v3 * v3;
    a0 += Math.abs(v0); a1 += Math.abs(v1); a2 += Math.abs(v2); a3 += Math.abs(v3);
    lo0 = Math.min(lo0, v0, v2);
    lo1 = Math.min(lo1, v1, v3);
    hi0 = Math.max(hi0, v0, v2);
    hi1 = Math.max(hi1, v1, v3);
  }
  let min = Math.min(lo0, lo1);
  let max = Math.max(hi0, hi1);
  for (let i = unrolledEnd; i < end; i++) {
    const v = x[i];
    s0 += v; q0 += v * v; a0 += Math.abs(v);
    min = Math.min(min, v);
    max = Math.max(max, v);
  }
  const mean = (s0 + s1 + s2 + s3) / count;
  let c0 = 0, c1 = 0, c2 = 0, c3 = 0;
  let d0 = 0, d1 = 0, d2 = 0, d3 = 0;
  for (let i = start; i < unrolledEnd; i += 4) {
    const e0 = x[i] - mean, e1 = x[i + 1] - mean, e2 = x[i + 2] - mean, e3 = x[i + 3] - mean;
    c0 += Math.abs(e0); c1 += Math.abs(e1); c2 += Math.abs(e2); c3 += Math.abs(e3);
    d0 += e0 * e0; d1 += e1 * e1; d2 += e2 * e2; d3 += e3 * e3;
  }
  for (let i = unrolledEnd; i < end; i++) {
    const e = x[i] - mean;
    c0 += Math.abs(e);
    d0 += e * e;
  }
  const rms = Math.sqrt((q0 + q1 + q2 + q3) / count);
  const rectifiedAverage = (a0 + a1 + a2 + a3) / count;
  const peak = Math.max(Math.abs(min), Math.abs(max));
  return {
    mean,
    rms,
    acRms: Math.sqrt((d0 + d1 + d2 + d3) / count),
    rectifiedAverage,
    acRectifiedAverage: (c0 + c1 + c2 + c3) / count,
    peak,
    min,
    max,
    peakToPeak: max - min,
    acPeak: Math.max(max - mean, mean - min),
    crestFactor: rms > 0 ? peak / rms : null,
    formFactor: rectifiedAverage > 0 ? rms / rectifiedAverage : null,
  };
}
