import { ref } from 'vue';
import { analyzeChannel } from '../../shared/analysis';
import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { CaptureDetail, SamplesResponse } from '../../shared/schemas/capture';
import { getSamples } from '../api/captures';

/** Largest span whose samples are fetched for figures in the browser. */
export const MAX_SPAN_SAMPLES = 1_000_000;

export interface SpanFigures {
  fromS: number;
  toS: number;
  sampleCount: number;
  channels: ChannelAnalysis[];
  /** Whole cycles in the span, or null when it is aperiodic; `fraction` is the part-cycle left out. */
  cycles: number | null;
  fraction: number;
}

/**
 * Figures of a selected span, computed at once in the browser by the same engine the server uses, on
 * the span's own samples.
 */
export function useSpanFigures(
  fetchSamples?: (captureId: number, q: { channel: number; fromS: number; toS: number; points: number }) => Promise<SamplesResponse>,
  /** Largest span this fetcher answers sample by sample (a share link answers fewer than a session). */
  maxSamples = MAX_SPAN_SAMPLES,
) {
  const fetch = fetchSamples ?? getSamples;
  const span = ref<SpanFigures | null>(null);
  const busy = ref(false);
  const error = ref('');

  async function measure(capture: CaptureDetail, fromS: number, toS: number) {
    error.value = '';
    const rate = capture.sampleRate ?? 1;
    const count = Math.round((toS - fromS) * rate);
    if (count < 4) {
      span.value = null;
      return;
    }
    if (count > maxSamples) {
      error.value = `The span holds ${count.toLocaleString()} samples; select at most ${maxSamples.toLocaleString()} for figures in the browser.`;
      return;
    }
    busy.value = true;
    try {
      const channels: ChannelAnalysis[] = [];
      for (const ch of capture.channels) {
        const s = await fetch(capture.id, { channel: ch.index, fromS, toS, points: maxSamples });
        const x = Float64Array.from(s.values ?? [], (v) => (v === null ? NaN : v));
        const valid = x.filter((v) => !Number.isNaN(v));
        channels.push(analyzeChannel(valid.length === x.length ? x : valid, rate, { t0: s.t0S }));
      }
      const first = channels[0];
      const exactCycles = first.frequency ? (count / rate) * first.frequency : null;
      span.value = {
        fromS,
        toS,
        sampleCount: count,
        channels,
        cycles: first.window.cycles,
        fraction: exactCycles !== null && first.window.cycles !== null ? exactCycles - first.window.cycles : 0,
      };
    } catch (e) {
      error.value = e instanceof Error ? e.message : String(e);
    } finally {
      busy.value = false;
    }
  }

  return { span, busy, error, measure, clear: () => (span.value = null) };
}
