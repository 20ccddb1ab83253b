import { CsvError } from './CsvError';

export interface TimeBase {
  /** Seconds between samples. */
  interval: number;
  /** Time of the first sample, in seconds (negative before a trigger). */
  t0: number;
  /** Largest distance of a printed time from the steady grid, in sample intervals (rounding shows here). */
  maxDeviation: number;
}

/**
 * The sample interval of a time column: the span over the number of steps, which averages out the
 * rounding of printed times that single differences suffer from. Gaps or jitter beyond the rounding of
 * the printed times mean irregular sampling, which is refused (naming the line) rather than resampled.
 *
 * @param t time values in the column's unit
 * @param scale seconds per unit
 * @param firstLine file line of t[0]; lineOf maps a row to its file line
 */
export function timeBaseFromColumn(t: Float64Array, scale: number, lineOf: (row: number) => number): TimeBase {
  const n = t.length;
  const step = (t[n - 1] - t[0]) / (n - 1);
  if (!(step > 0)) throw new CsvError('The time column does not advance: every row has the same time.', lineOf(n - 1));
  let quantum = Infinity;
  for (let i = 1; i < n; i++) {
    const d = t[i] - t[i - 1];
    if (d > 0 && d < quantum) quantum = d;
  }
  const irregular = (row: number, what: string) =>
    new CsvError(
      `Sampling is irregular: ${what}, against a steady step of ${(step * scale).toPrecision(4)} s. Crestline does not resample silently; export a record with a steady sample rate.`,
      lineOf(row),
    );
  // The typical single step, from the first steps (a gap would bias the span-based step).
  const first = Array.from({ length: Math.min(n - 1, 10001) }, (_, i) => t[i + 1] - t[i]).sort((a, b) => a - b);
  const typical = first[Math.floor(first.length / 2)];
  if (first[0] > 0) {
    // Times printed finely enough that every step shows: each must be about one sample interval
    // (rounding of the printed times moves a step by at most half of it).
    for (let i = 1; i < n; i++) {
      const d = t[i] - t[i - 1];
      if (d > 1.6 * typical || d < 0.4 * typical) throw irregular(i, `the time steps by ${(d / typical).toFixed(2)} sample intervals here`);
    }
  }
  const allowed = Math.max(1.5 * step, quantum);
  let worst = 0;
  let worstRow = 0;
  for (let i = 0; i < n; i++) {
    const dev = Math.abs(t[i] - (t[0] + i * step));
    if (dev > worst) {
      worst = dev;
      worstRow = i;
    }
  }
  if (worst > allowed) {
    throw irregular(worstRow, `the time at this line is ${(worst / step).toFixed(1)} sample intervals off the steady grid`);
  }
  return { interval: step * scale, t0: t[0] * scale, maxDeviation: worst / step };
}
