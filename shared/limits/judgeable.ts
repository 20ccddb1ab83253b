import { mainsSystemOf } from '../analysis/iec61000_4_7';
import type { ChannelAnalysis } from '../schemas/analysis';

/** Whole cycles of the IEC 61000-4-7 measurement window (about 200 ms) at 50 and 60 Hz. */
const WINDOW_CYCLES = { 50: 10, 60: 12 } as const;

/**
 * Why a channel's harmonics cannot be judged against a mains harmonic standard, or null when they can:
 * it needs a steady fundamental, a 50 or 60 Hz system (the engine's own rule, within 10 %), and at
 * least one 200 ms window of whole cycles.
 */
export function notJudgeableReason(a: ChannelAnalysis): string | null {
  const fundamental = a.harmonics[0];
  if (a.frequency === null || !fundamental || !(fundamental.rms > 0)) {
    return 'The channel has no steady fundamental, so it has no harmonics to judge.';
  }
  const mains = mainsSystemOf(a.frequency);
  if (mains === null) return `The fundamental is ${a.frequency.toFixed(2)} Hz: these limits are for 50 Hz and 60 Hz supplies.`;
  const needed = WINDOW_CYCLES[mains];
  if ((a.window.cycles ?? 0) < needed) {
    return `The analysis window holds ${a.window.cycles ?? 0} whole cycles; the standards measure over windows of ${needed} cycles at ${mains} Hz (about 200 ms), so capture at least that.`;
  }
  return null;
}

/** Harmonic RMS by order, in V or A (the channel's values times `factor`); undefined where not measured. */
export function harmonicsByOrder(a: ChannelAnalysis, factor: number): Map<number, number> {
  return new Map(a.harmonics.map((h) => [h.order, h.rms * factor]));
}

/** A note naming the orders the sample rate did not reach, or null when all up to `top` were measured. */
export function unmeasuredNote(measured: Map<number, number>, top: number): string | null {
  const highest = Math.max(0, ...measured.keys());
  return highest >= top ? null : `Orders above ${highest} were not measured (the sample rate allows no more) and are not judged.`;
}
