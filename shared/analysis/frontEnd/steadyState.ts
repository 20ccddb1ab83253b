import type { Samples } from '../samples';
import { buildFrontEnd } from './buildFrontEnd';
import type { ResolvedFrontEnd } from './resolveFrontEnd';

/** The converter output once every filter has settled on a loop repeated forever. */
export interface SteadyState {
  /** Mean output over the loop: the settled reading, in the channel's unit. */
  mean: number;
  peakToPeak: number;
  /**
   * Peak-to-peak swing of the output averaged over one fundamental period: the slow wander left once
   * the ripple at the fundamental and its harmonics is averaged out (all of peakToPeak when aperiodic).
   */
  wanderPeakToPeak: number;
  /** Share of the loop's samples the input stage clips. */
  clippedFraction: number;
}

/** Peak-to-peak of the moving average of `x` over `P` samples, taken round the loop. */
function averagedSwing(x: Float64Array, P: number): number {
  let sum = 0;
  for (let i = 0; i < P; i++) sum += x[i];
  let lo = sum;
  let hi = sum;
  for (let i = P; i < x.length + P - 1; i++) {
    sum += x[i % x.length] - x[i - P];
    if (sum < lo) lo = sum;
    if (sum > hi) hi = sum;
  }
  return (hi - lo) / P;
}

/**
 * The periodic steady state of front end `p` on `loop` (samples per second `sampleRateHz`), solved
 * directly; `periodSamples` is the fundamental's period, or null when the loop is aperiodic.
 */
export function steadyStateOf(p: ResolvedFrontEnd, sampleRateHz: number, loop: Samples, periodSamples: number | null = null): SteadyState {
  const { output, clipped } = buildFrontEnd(p, sampleRateHz).settleOn(loop);
  let sum = 0;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < output.length; i++) {
    const v = output[i];
    sum += v;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const P = periodSamples === null ? 0 : Math.round(periodSamples);
  const wanderPeakToPeak = P >= 2 && P < output.length ? averagedSwing(output, P) : P >= output.length ? 0 : hi - lo;
  return { mean: sum / output.length, peakToPeak: hi - lo, wanderPeakToPeak, clippedFraction: clipped / loop.length };
}
