import type { Samples } from './samples';

/**
 * Averages each run of `factor` samples into one: a low-pass (a moving average) and a decimation in
 * one pass. Its response is known exactly (`averagingGain`), so amplitudes read from the result can be
 * corrected; sample i of the result stands at the middle of its run, (i + ½)·factor − ½ in the input.
 */
export function decimateByAverage(x: Samples, factor: number): Float64Array {
  const n = Math.floor(x.length / factor);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    const from = i * factor;
    for (let j = from; j < from + factor; j++) s += x[j];
    out[i] = s / factor;
  }
  return out;
}

/** Magnitude response of a `factor`-sample average at `hz` for input rate `sampleRate`: |sin(πfD/fs) / (D·sin(πf/fs))|. */
export function averagingGain(hz: number, sampleRate: number, factor: number): number {
  if (factor === 1 || hz === 0) return 1;
  const a = (Math.PI * hz) / sampleRate;
  return Math.abs(Math.sin(a * factor) / (factor * Math.sin(a)));
}
