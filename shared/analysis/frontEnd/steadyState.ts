import type { Samples } from '../samples';
import { buildFrontEnd } from './buildFrontEnd';
import type { ResolvedFrontEnd } from './resolveFrontEnd';

/** The converter output once every filter has settled on a loop repeated forever. */
export interface SteadyState {
  /** Mean output over the loop: the settled reading, in the channel's unit. */
  mean: number;
  peakToPeak: number;
  /** Share of the loop's samples the input stage clips. */
  clippedFraction: number;
}

/** The periodic steady state of front end `p` on `loop` (samples per second `sampleRateHz`), solved directly. */
export function steadyStateOf(p: ResolvedFrontEnd, sampleRateHz: number, loop: Samples): SteadyState {
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
  return { mean: sum / output.length, peakToPeak: hi - lo, clippedFraction: clipped / loop.length };
}
