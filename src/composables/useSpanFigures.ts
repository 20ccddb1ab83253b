import { ref, shallowRef } from 'vue';
import type { ValidSpanResult } from '../../shared/analysis';
import type { CaptureDetail, SamplesQuery, SamplesResponse } from '../../shared/schemas/capture';
import { getSamples } from '../api/captures';
import { analyzeOffMainThread } from '../figures/analyzeOffMainThread';
import { rawSamples } from '../figures/rawSamples';

/** Largest span whose samples are fetched for figures in the browser. */
export const MAX_SPAN_SAMPLES = 1_000_000;

export interface SpanFigures {
  fromS: number;
  toS: number;
  sampleCount: number;
  /** Per channel: its figures, or why the span cannot be analysed soundly. */
  channels: ValidSpanResult[];
  /** Whole cycles of the first analysable channel, or null when it is aperiodic; `fraction` is the part-cycle left out. */
  cycles: number | null;
  fraction: number;
}

/** Where a capture's samples come from: the signed-in API, or a share link. */
export type SamplesSource = (captureId: number, q: SamplesQuery) => Promise<SamplesResponse>;

/**
 * Figures of a selected span, by the same engine and the same valid-span rule as the server: a span with
 * empty or overrange samples is analysed over its longest valid stretch, never spliced across the gap, or
 * not at all (with the engine's reason). The work runs in a Web Worker.
 */
export function useSpanFigures(
  fetchSamples: SamplesSource = getSamples,
  /** Largest span this fetcher answers sample by sample (a share link answers fewer than a session). */
  maxSamples = MAX_SPAN_SAMPLES,
) {
  const span = shallowRef<SpanFigures | null>(null);
  const busy = ref(false);
  const error = ref('');
  let latest = 0;

  async function measure(capture: CaptureDetail, fromS: number, toS: number) {
    const ask = ++latest;
    error.value = '';
    const rate = capture.sampleRate ?? 1;
    const count = Math.round((toS - fromS) * rate);
    if (count < 4) {
      span.value = null;
      return;
    }
    if (count > maxSamples) {
      error.value = `The span holds ${count.toLocaleString('en')} samples; select at most ${maxSamples.toLocaleString('en')} for figures in the browser.`;
      return;
    }
    busy.value = true;
    try {
      const answers = await Promise.all(capture.channels.map((ch) => fetchSamples(capture.id, { channel: ch.index, fromS, toS, points: maxSamples })));
      const channels = await analyzeOffMainThread({ kind: 'span', channels: answers.map((s) => rawSamples(s)), sampleRate: rate, t0S: answers[0]?.t0S ?? fromS });
      if (ask !== latest) return;
      span.value = { fromS, toS, sampleCount: count, channels, ...cyclesOf(channels, count / rate) };
    } catch (e) {
      if (ask === latest) error.value = e instanceof Error ? e.message : String(e);
    } finally {
      if (ask === latest) busy.value = false;
    }
  }

  return { span, busy, error, measure, clear: () => (span.value = null) };
}

/** Whole cycles used and the part-cycle left out, from the first channel analysed over the whole span. */
function cyclesOf(channels: ValidSpanResult[], seconds: number): { cycles: number | null; fraction: number } {
  const first = channels.find((c) => c.ok);
  if (!first?.ok) return { cycles: null, fraction: 0 };
  const a = first.analysis;
  // Over a valid stretch shorter than the span, the engine's own warning says what was left out.
  const whole = !a.warnings.some((w) => w.code === 'invalidSamples');
  const exact = a.frequency !== null && whole ? seconds * a.frequency : null;
  return { cycles: a.window.cycles, fraction: exact !== null && a.window.cycles !== null ? exact - a.window.cycles : 0 };
}
