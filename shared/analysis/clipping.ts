import type { Samples } from './samples';

export interface ClippingFinding {
  rail: 'max' | 'min';
  value: number;
  samples: number;
  runs: number;
}

/**
 * The lowest and highest sample (NaN skipped), the rails findClipping looks at. An indexed loop, not
 * for…of: 1–2 ms instead of about 9 ms on 1 M samples here.
 */
export function sampleRange(x: Samples): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/**
 * Flat tops at the record's extremes that look like an instrument's rail rather than the waveform.
 *
 * A rail is reported when (1) at least three samples sit exactly on it in a run of three or more,
 * (2) it holds at least four times as many samples as the next value below it (a quantised but
 * unclipped peak holds about 2.4 times as many: a parabola spends √1 : √2 − 1 of its time in the
 * top two codes), and (3) the signal reaches it gradually (median step into the run under a quarter
 * of peak-to-peak), which tells a clipped sine from the legitimate flat top of a square wave.
 */
export function findClipping(x: Samples, start: number, count: number, min: number, max: number): ClippingFinding[] {
  const span = max - min;
  if (!(span > 0)) return [];
  const findings: ClippingFinding[] = [];
  for (const rail of ['max', 'min'] as const) {
    const value = rail === 'max' ? max : min;
    const sign = rail === 'max' ? 1 : -1;
    const tol = span * 1e-12;
    let atRail = 0;
    let runs = 0;
    let run = 0;
    let next = -Infinity;
    const steps: number[] = [];
    for (let i = start; i < start + count; i++) {
      const v = x[i] * sign;
      if (Math.abs(x[i] - value) <= tol) {
        atRail++;
        if (run === 0 && i > start) steps.push(Math.abs(value - x[i - 1]));
        run++;
      } else {
        if (run >= 3) runs++;
        run = 0;
        if (v > next) next = v;
      }
    }
    if (run >= 3) runs++;
    if (atRail < 3 || runs === 0) continue;
    let belowRail = 0;
    for (let i = start; i < start + count; i++) if (Math.abs(x[i] * sign - next) <= tol) belowRail++;
    if (atRail < 4 * belowRail) continue;
    steps.sort((a, b) => a - b);
    const medianStep = steps.length ? steps[Math.floor(steps.length / 2)] : 0;
    if (medianStep >= 0.25 * span) continue;
    findings.push({ rail, value, samples: atRail, runs });
  }
  return findings;
}
