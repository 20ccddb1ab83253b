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
 * Two passes: the first gathers Σx, Σx², Σ|x|, min and max; the second Σ|x − mean| and
 * Σ(x − mean)². The AC RMS comes from the second sum rather than from rms² − mean², which would
 * cancel catastrophically for a small ripple on a large DC level (and could go negative).
 */
export function timeDomainFigures(x: Samples, start = 0, count = x.length - start): TimeDomainFigures {
  if (count <= 0 || start < 0 || start + count > x.length) {
    throw new RangeError(`timeDomainFigures: span ${start}+${count} is outside a record of ${x.length} samples`);
  }
  const end = start + count;
  let sum = 0;
  let sumSq = 0;
  let sumAbs = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = start; i < end; i++) {
    const v = x[i];
    sum += v;
    sumSq += v * v;
    sumAbs += v < 0 ? -v : v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const mean = sum / count;
  let sumAcAbs = 0;
  let sumAcSq = 0;
  for (let i = start; i < end; i++) {
    const d = x[i] - mean;
    sumAcAbs += d < 0 ? -d : d;
    sumAcSq += d * d;
  }
  const rms = Math.sqrt(sumSq / count);
  const rectifiedAverage = sumAbs / count;
  const peak = Math.max(Math.abs(min), Math.abs(max));
  return {
    mean,
    rms,
    acRms: Math.sqrt(sumAcSq / count),
    rectifiedAverage,
    acRectifiedAverage: sumAcAbs / count,
    peak,
    min,
    max,
    peakToPeak: max - min,
    acPeak: Math.max(max - mean, mean - min),
    crestFactor: rms > 0 ? peak / rms : null,
    formFactor: rectifiedAverage > 0 ? rms / rectifiedAverage : null,
  };
}
