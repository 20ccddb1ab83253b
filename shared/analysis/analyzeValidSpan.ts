import type { ChannelAnalysis } from '../schemas/analysis';
import { analyzeChannel, type AnalysisSettings } from './analyzeChannel';
import type { Samples } from './samples';

/** Share of the record the longest valid stretch must cover for its figures to stand for the record. */
const MIN_VALID_SHARE = 0.5;

export type ValidSpanResult = { ok: true; analysis: ChannelAnalysis } | { ok: false; reason: string };

/**
 * Analyses a channel that may hold invalid samples (NaN: empty or overrange cells). Joining the valid
 * samples across a gap would splice the waveform and corrupt frequency and harmonics, so the figures
 * come from the longest unbroken valid stretch, when it covers at least half of the record.
 */
export function analyzeValidSpan(x: Samples, sampleRate: number, settings: AnalysisSettings = {}): ValidSpanResult {
  let invalid = 0;
  let bestStart = 0;
  let bestLength = 0;
  let runStart = 0;
  for (let i = 0; i <= x.length; i++) {
    if (i === x.length || Number.isNaN(x[i])) {
      if (i < x.length) invalid++;
      if (i - runStart > bestLength) {
        bestStart = runStart;
        bestLength = i - runStart;
      }
      runStart = i + 1;
    }
  }
  if (invalid === 0) return { ok: true, analysis: analyzeChannel(x, sampleRate, settings) };
  if (bestLength < 2 || bestLength < MIN_VALID_SHARE * x.length) {
    return {
      ok: false,
      reason: `${invalid} of ${x.length} samples are empty or overrange, and the longest valid stretch (${bestLength} samples) is less than half the record; re-capture with a larger range.`,
    };
  }
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
