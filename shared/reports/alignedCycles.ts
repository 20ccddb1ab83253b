import { risingZeroCrossings, timeDomainFigures } from '../analysis';
import type { SamplesResponse } from '../schemas/capture';

/** A trace on the shared time grid: one line (raw samples), or a lower and upper envelope (min/max buckets). */
export interface AlignedTrace {
  lo: (number | null)[];
  /** Null when the trace is a single line. */
  hi: (number | null)[] | null;
}

/**
 * One value per element with the time of element i at t0S + (i + offset)·stepS: the samples themselves,
 * or the middle of each bucket, whose extremes lie somewhere inside it.
 */
function centreLine(s: SamplesResponse): { values: number[]; offset: number } {
  switch (s.mode) {
    case 'raw':
      return { values: s.values.map((v) => v ?? NaN), offset: 0 };
    case 'minmax':
      return { values: s.min.map((lo, i) => (lo === null || s.max[i] === null ? NaN : (lo + s.max[i]!) / 2)), offset: 0.5 };
  }
}

/** Time of the first rising zero crossing of x − mean (with hysteresis, as the engine finds them); null if none. */
export function firstRisingCrossing(s: SamplesResponse): number | null {
  const { values, offset } = centreLine(s);
  const valid = values.filter((x) => !Number.isNaN(x));
  if (valid.length < 3) return null;
  const f = timeDomainFigures(Float64Array.from(valid));
  const first = risingZeroCrossings(values, f.mean, f.acRms, f.min - f.mean, f.max - f.mean).times[0];
  return first === undefined ? null : s.t0S + (first + offset) * s.stepS;
}

/** The trace at time t: interpolated between raw samples, or the extremes of the bucket holding t; null outside it or over a gap. */
export function envelopeAt(s: SamplesResponse, t: number): { lo: number; hi: number } | null {
  const pos = (t - s.t0S) / s.stepS;
  const i = Math.floor(pos);
  switch (s.mode) {
    case 'raw': {
      const a = s.values[i];
      const b = s.values[i + 1];
      if (i < 0 || a == null || b == null) return null;
      const v = a + (b - a) * (pos - i);
      return { lo: v, hi: v };
    }
    case 'minmax': {
      const lo = s.min[i];
      const hi = s.max[i];
      return i < 0 || lo == null || hi == null ? null : { lo, hi };
    }
  }
}

/**
 * Captures on one time grid of `points` instants over `spanS` seconds, each from its first rising zero
 * crossing ('zeroCrossing'; from its first sample when it has none) or from the start of its window ('trigger').
 */
export function alignedTraces(inputs: { samples: SamplesResponse; fromS: number }[], align: 'zeroCrossing' | 'trigger', spanS: number, points = 1200) {
  const x = Array.from({ length: points }, (_, i) => (i / (points - 1)) * spanS);
  const traces: AlignedTrace[] = inputs.map(({ samples, fromS }) => {
    const start = align === 'zeroCrossing' ? (firstRisingCrossing(samples) ?? fromS) : fromS;
    const at = x.map((t) => envelopeAt(samples, start + t));
    const lo = at.map((e) => e?.lo ?? null);
    return { lo, hi: samples.mode === 'minmax' ? at.map((e) => e?.hi ?? null) : null };
  });
  return { x, traces };
}
