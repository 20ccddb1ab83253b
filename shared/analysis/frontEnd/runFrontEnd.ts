import type { FrontEnd } from './buildFrontEnd';
import type { RunPlan } from './planRun';
import { DisplaySampler, EnvelopeTrace, SettlingTracker } from './runTrackers';

const TRACE_POINTS = 2000;
const BLOCK = 65536;

export interface RunResult {
  trace: { tS: number; value: number }[];
  displaySamples: { tS: number; value: number }[];
  settlingTimeS: number | null;
  simulatedSamples: number;
}

/**
 * Feeds the plan's source through the front end block by block (passing round it as often as planned),
 * keeping only the trace envelope, the display's samples and the settling time. A looped run stops once
 * the reading has stayed settled for a loop, two display updates and a quarter of its settling time.
 */
export function runFrontEnd(fe: FrontEnd, plan: RunPlan, target: number, periodSamples: number | null, display: { rateHz: number; alreadyShowing: boolean }, stopWhenSettled: boolean): RunResult {
  const { source, sampleRateHz: fs, plannedSamples } = plan;
  const trace = new EnvelopeTrace(plannedSamples, TRACE_POINTS);
  const shown = new DisplaySampler(display.rateHz, fs, display.alreadyShowing);
  const settling = new SettlingTracker(target, periodSamples);
  const block = new Float64Array(Math.min(BLOCK, plannedSamples));
  const L = source.length;
  const margin = (settledAtS: number) => Math.max(L / fs, 2 / display.rateHz, 0.25 * settledAtS);
  let done = 0;
  let pos = 0;
  while (done < plannedSamples) {
    const m = Math.min(block.length, plannedSamples - done);
    for (let k = 0; k < m; ) {
      const take = Math.min(m - k, L - pos);
      block.set(source.subarray(pos, pos + take), k);
      k += take;
      pos = (pos + take) % L;
    }
    fe.process(block, m);
    trace.push(block, m, done);
    shown.push(block, m, done);
    settling.push(block, m, done);
    done += m;
    const settledAt = settling.settlingTimeS(fs);
    if (stopWhenSettled && settledAt !== null && done / fs - settledAt >= margin(settledAt)) break;
  }
  return { trace: trace.finish(fs), displaySamples: shown.samples, settlingTimeS: settling.settlingTimeS(fs), simulatedSamples: done };
}
