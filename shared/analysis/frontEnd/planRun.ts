import type { Samples } from '../samples';
import { resampleLoop } from './resampleLoop';
import type { ResolvedFrontEnd } from './resolveFrontEnd';

/** Samples a looped run may simulate; beyond it the loop is resampled to a lower rate (8 M take about 0.1 s here). */
export const RUN_BUDGET_SAMPLES = 8_000_000;
/** Longest looped run, in seconds: 12 of the slowest time constants (10 s + 10 s) fit. */
export const MAX_RUN_S = 300;

export interface RunPlan {
  /** What each pass feeds the front end: the span once, or the loop (resampled when decimated). */
  source: Samples;
  sampleRateHz: number;
  decimation: number;
  /** Samples to simulate at most; a looped run stops earlier once it has settled. */
  plannedSamples: number;
}

const slowestTauS = (p: ResolvedFrontEnd) => (p.coupling === 'ac' ? p.couplingTauS : 0) + p.averagingTauS * (p.filterOrder === 2 ? 1.5 : 1) + (p.chargeTauS ?? 0);

/**
 * Played once, the run is the span at its own rate. Looped, it lasts long enough for twelve of the
 * front end's slowest time constants (e^(−12) leaves nothing of any start), at most MAX_RUN_S, and
 * resamples the loop when that many passes would exceed RUN_BUDGET_SAMPLES.
 */
export function planRun(p: ResolvedFrontEnd, span: Samples, loop: Samples, sampleRateHz: number, repeat: boolean): RunPlan {
  if (!repeat) return { source: span, sampleRateHz, decimation: 1, plannedSamples: span.length };
  const loopS = loop.length / sampleRateHz;
  const planS = Math.min(MAX_RUN_S, Math.max(2 * loopS, 12 * slowestTauS(p) + 2 / p.displayRateHz));
  const passes = Math.ceil(planS / loopS);
  const m = Math.min(loop.length, Math.max(1, Math.round(RUN_BUDGET_SAMPLES / passes)));
  if (m === loop.length) return { source: loop, sampleRateHz, decimation: 1, plannedSamples: passes * m };
  const decimation = loop.length / m;
  return { source: resampleLoop(loop, m), sampleRateHz: sampleRateHz / decimation, decimation, plannedSamples: passes * m };
}
