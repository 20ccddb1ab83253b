import type { Samples } from '../samples';

/**
 * A loop of `x.length` samples as `m` samples, each the mean of the input over its own 1/m of the loop
 * (the input taken as held over each sample, fractional samples weighted by the part that falls
 * inside). The loop keeps its exact duration, so repeating it stays seamless whatever x.length / m is.
 *
 * As a decimation by D = x.length / m this is a D-sample moving average then a pick: it scales a
 * component at f by about sin(πfD/fs) / (D·sin(πf/fs)) ≈ 1 − (πfD/fs)²/6 (see averagingGain), so the
 * rate after it must stay well above the waveform's harmonics of interest.
 */
export function resampleLoop(x: Samples, m: number): Float64Array {
  const n = x.length;
  if (!(m >= 1 && m <= n && Number.isInteger(m))) throw new RangeError(`resampleLoop: ${m} samples must be a whole number from 1 to the loop's ${n}`);
  const out = new Float64Array(m);
  const width = n / m;
  let i = 0;
  for (let j = 0; j < m; j++) {
    const from = j * width;
    const to = j === m - 1 ? n : (j + 1) * width;
    let sum = 0;
    i = Math.floor(from);
    // Part of the first sample, the whole ones, part of the last.
    while (i < to) {
      const lo = Math.max(from, i);
      const hi = Math.min(to, i + 1);
      sum += (hi - lo) * x[i];
      i++;
    }
    out[j] = sum / (to - from);
  }
  return out;
}
