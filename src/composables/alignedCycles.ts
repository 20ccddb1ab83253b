import type { SamplesResponse } from '../../shared/schemas/capture';

/** Time of the first rising zero crossing of x − mean (with hysteresis), by linear interpolation; null if none. */
export function firstRisingCrossing(s: SamplesResponse): number | null {
  const v = (s.values ?? []).map((x) => (x === null ? NaN : x));
  const valid = v.filter((x) => !Number.isNaN(x));
  if (valid.length < 3) return null;
  const mean = valid.reduce((a, b) => a + b, 0) / valid.length;
  const rms = Math.sqrt(valid.reduce((a, b) => a + (b - mean) ** 2, 0) / valid.length);
  const h = 0.1 * rms;
  let armed = false;
  for (let i = 1; i < v.length; i++) {
    const d = v[i] - mean;
    if (d < -h) armed = true;
    else if (armed && d >= h) {
      let j = i;
      while (j > 0 && v[j - 1] - mean >= 0) j--;
      if (j === 0) return null;
      const a = v[j - 1] - mean;
      const b = v[j] - mean;
      return s.t0S + (j - 1 + -a / (b - a)) * s.stepS;
    }
  }
  return null;
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
