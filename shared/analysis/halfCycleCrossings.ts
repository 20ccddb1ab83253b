import type { Samples } from './samples';

/** Hysteresis of the crossing detector, as a share of the record's AC RMS. */
const HYSTERESIS_OF_AC_RMS = 0.1;

/**
 * Rising and falling zero crossings of `x − mean`, in samples (fractional, by linear interpolation),
 * in time order. The detector changes state only past ±10 % of the AC RMS, so noise and harmonic
 * wiggles near zero cannot fire it twice; the crossing itself is placed where the signal last
 * changed sign. NaN samples are skipped.
 *
 * @param x samples
 * @param mean the record's mean (the zero the crossings are measured against)
 * @param acRms the record's AC RMS
 */
export function halfCycleCrossings(x: Samples, mean: number, acRms: number): number[] {
  const h = HYSTERESIS_OF_AC_RMS * acRms;
  const out: number[] = [];
  let state = 0;
  for (let i = 0; i < x.length; i++) {
    const v = x[i] - mean;
    const next = v >= h ? 1 : v <= -h ? -1 : state;
    if (next !== state && state !== 0) {
      // Back to the last sample on the other side of zero, then interpolate between it and the next.
      let j = i;
      while (j > 0 && !Number.isNaN(x[j - 1]) && Math.sign(x[j - 1] - mean) === next) j--;
      if (j > 0 && !Number.isNaN(x[j - 1])) {
        const a = x[j - 1] - mean;
        const b = x[j] - mean;
        out.push(b === a ? j : j - 1 + -a / (b - a));
      }
    }
    state = next;
  }
  return out;
}

/**
 * Half-cycle boundaries for cycle-by-cycle values: the crossings, with the gaps where the signal
 * stopped crossing (an interruption, a deep dip) filled in at the nominal half period, so the values
 * go on through the event rather than stopping.
 *
 * @param crossings crossing positions in samples, in time order
 * @param halfPeriod nominal half period in samples
 */
export function halfCycleBoundaries(crossings: number[], halfPeriod: number): number[] {
  const out: number[] = [];
  for (let k = 0; k < crossings.length; k++) {
    const c = crossings[k];
    if (out.length) {
      const last = out[out.length - 1];
      const missing = Math.round((c - last) / halfPeriod) - 1;
      if (missing > 0) for (let m = 1; m <= missing; m++) out.push(last + ((c - last) * m) / (missing + 1));
    }
    out.push(c);
  }
  return out;
}
