import type { ChannelAnalysis } from '../schemas/analysis';
import { analyzeChannel, type AnalysisSettings } from './analyzeChannel';
import { longestValidStretch, validStretchProblem } from './longestValidStretch';
import type { Samples } from './samples';

export type ValidSpanResult = { ok: true; analysis: ChannelAnalysis } | { ok: false; reason: string };

/**
 * Analyses a channel that may hold invalid samples (NaN: empty or overrange cells). Joining the valid
 * samples across a gap would splice the waveform and corrupt frequency and harmonics, so the figures
 * come from the longest unbroken valid stretch, when it covers at least half of the record.
 */
export function analyzeValidSpan(x: Samples, sampleRate: number, settings: AnalysisSettings = {}): ValidSpanResult {
  const { start: bestStart, length: bestLength, invalid } = longestValidStretch(x);
  if (invalid === 0) return { ok: true, analysis: analyzeChannel(x, sampleRate, settings) };
  const problem = validStretchProblem({ start: bestStart, length: bestLength, invalid }, x.length);
  if (problem) return { ok: false, reason: problem };
  const t0 = (settings.t0 ?? 0) + bestStart / sampleRate;
  // The record's clipping search covered the whole record, not this stretch: it is done again here.
  const analysis = analyzeChannel(x.subarray(bestStart, bestStart + bestLength), sampleRate, { ...settings, t0, clipping: undefined });
  analysis.window.startIndex += bestStart;
  analysis.warnings.unshift({
    code: 'invalidSamples',
    severity: 'warning',
    message: `${invalid} samples are empty or overrange; the figures cover the longest valid stretch (${bestLength} of ${x.length} samples).`,
  });
  return { ok: true, analysis };
}
