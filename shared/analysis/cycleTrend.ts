import { halfCycleBoundaries, halfCycleCrossings } from './halfCycleCrossings';
import type { Samples } from './samples';

export type TrendKind = 'rmsHalfCycle' | 'rmsCycle' | 'frequencyCycle';

/** One value of a trend, stamped at the middle of the span it covers (s), so it lines up with the waveform. */
export interface TrendPoint {
  tS: number;
  value: number;
}

function validFigures(x: Samples): { mean: number; acRms: number } {
  let s = 0;
  let n = 0;
  for (let i = 0; i < x.length; i++) {
    if (Number.isNaN(x[i])) continue;
    s += x[i];
    n++;
  }
  const mean = n ? s / n : 0;
  let q = 0;
  for (let i = 0; i < x.length; i++) if (!Number.isNaN(x[i])) q += (x[i] - mean) ** 2;
  return { mean, acRms: n ? Math.sqrt(q / n) : 0 };
}

/** RMS of x[from, to); NaN when the span holds an invalid sample. */
function spanRms(x: Samples, from: number, to: number): number {
  let s = 0;
  for (let i = from; i < to; i++) s += x[i] * x[i];
  return Math.sqrt(s / (to - from));
}

/**
 * Values from cycle to cycle, synchronised to the fundamental's zero crossings:
 * - `rmsHalfCycle`: the RMS over one cycle, refreshed every half cycle (Urms(1/2) of IEC 61000-4-30);
 * - `rmsCycle`: the RMS over each cycle, one value a cycle;
 * - `frequencyCycle`: 1/period between consecutive rising crossings, in Hz.
 * Where the signal stops crossing zero (an interruption), the windows go on at the nominal period.
 *
 * @param x samples (NaN for invalid ones: windows holding one are left out)
 * @param sampleRate samples per second
 * @param frequency the record's fundamental in Hz
 * @param t0 time of x[0] in s
 */
export function cycleTrend(x: Samples, sampleRate: number, frequency: number, kind: TrendKind, t0 = 0): TrendPoint[] {
  if (!(frequency > 0) || !(sampleRate > 0)) return [];
  const halfPeriod = sampleRate / frequency / 2;
  const { mean, acRms } = validFigures(x);
  if (!(acRms > 0)) return [];
  const crossings = halfCycleCrossings(x, mean, acRms);
  const at = (samples: number) => t0 + samples / sampleRate;
  const out: TrendPoint[] = [];
  if (kind === 'frequencyCycle') {
    // Rising crossings alternate with falling ones; take every other one starting at the first rising one.
    const first = crossings.findIndex((c) => x[Math.min(x.length - 1, Math.floor(c) + 1)] - mean > 0);
    for (let k = first; k >= 0 && k + 2 < crossings.length; k += 2) {
      const period = crossings[k + 2] - crossings[k];
      // A gap (no crossings for a while) is not a cycle of some low frequency.
      if (period > 3 * halfPeriod || period < halfPeriod) continue;
      out.push({ tS: at((crossings[k] + crossings[k + 2]) / 2), value: sampleRate / period });
    }
    return out;
  }
  const b = halfCycleBoundaries(crossings, halfPeriod);
  const step = kind === 'rmsHalfCycle' ? 1 : 2;
  for (let k = 0; k + 2 < b.length; k += step) {
    // Rounded rather than ceiled: a crossing a hair before or after a sample must not add or drop one.
    const from = Math.round(b[k]);
    const to = Math.round(b[k + 2]);
    if (to - from < 2) continue;
    const value = spanRms(x, from, to);
    if (!Number.isNaN(value)) out.push({ tS: at((b[k] + b[k + 2]) / 2), value });
  }
  return out;
}

/**
 * At most `maxPoints` points: above it, the points are split into buckets and each keeps its lowest
 * and its highest point (in time order), so a dip or a swell survives the thinning.
 */
export function thinTrend(points: TrendPoint[], maxPoints: number): TrendPoint[] {
  if (points.length <= maxPoints) return points;
  const buckets = Math.max(1, Math.floor(maxPoints / 2));
  const out: TrendPoint[] = [];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * points.length) / buckets);
    const to = Math.floor(((b + 1) * points.length) / buckets);
    if (to <= from) continue;
    let lo = from;
    let hi = from;
    for (let i = from; i < to; i++) {
      if (points[i].value < points[lo].value) lo = i;
      if (points[i].value > points[hi].value) hi = i;
    }
    if (lo === hi) out.push(points[lo]);
    else out.push(points[Math.min(lo, hi)], points[Math.max(lo, hi)]);
  }
  return out;
}
