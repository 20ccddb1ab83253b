import { risingZeroCrossings, timeDomainFigures } from '../analysis';
import type { SamplesResponse } from '../schemas/capture';

/** Time of the first rising zero crossing of x − mean (with hysteresis, as the engine finds them); null if none. */
export function firstRisingCrossing(s: SamplesResponse): number | null {
  const v = (s.values ?? []).map((x) => (x === null ? NaN : x));
  const valid = v.filter((x) => !Number.isNaN(x));
  if (valid.length < 3) return null;
  const f = timeDomainFigures(Float64Array.from(valid));
  const first = risingZeroCrossings(v, f.mean, f.acRms, f.min - f.mean, f.max - f.mean).times[0];
  return first === undefined ? null : s.t0S + first * s.stepS;
}

/** Linear interpolation of a samples response at time t (null outside it or over a gap). */
export function valueAt(s: SamplesResponse, t: number): number | null {
  const values = s.values ?? [];
  const pos = (t - s.t0S) / s.stepS;
  const i = Math.floor(pos);
  if (i < 0 || i + 1 >= values.length) return null;
  const a = values[i];
  const b = values[i + 1];
  if (a === null || b === null) return null;
  return a + (b - a) * (pos - i);
}
