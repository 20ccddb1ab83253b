import { describe, expect, it, vi } from 'vitest';
import { analyzeChannel } from '../../../../shared/analysis';
import type { CaptureDetail, SamplesQuery, SamplesResponse } from '../../../../shared/schemas/capture';
import { MAX_SPAN_SAMPLES, useSpanFigures } from '../../../../src/composables/useSpanFigures';

const FS = 10_000;
const capture = { id: 7, sampleRate: FS, channels: [{ index: 0, name: 'Mains', unit: 'V', invalidCount: 0 }] } as CaptureDetail;
/** 50 Hz, 325 V peak, 200 samples a cycle; samples in [gapFrom, gapTo) overrange (null). */
const mains = (n: number, gapFrom = n, gapTo = n) => Array.from({ length: n }, (_, i) => (i >= gapFrom && i < gapTo ? null : 325 * Math.sin(2 * Math.PI * 50 * (i / FS))));
const answering = (values: (number | null)[]) => vi.fn(async (_id: number, q: SamplesQuery): Promise<SamplesResponse> => ({ channel: q.channel, mode: 'raw', t0S: 0, stepS: 1 / FS, startIndex: 0, sampleCount: values.length, values }));

describe('useSpanFigures', () => {
  it('a clean span: the engine’s figures of its samples', async () => {
    const values = mains(2000);
    const span = useSpanFigures(answering(values));
    await span.measure(capture, 0, 0.2);
    const [ch] = span.span.value!.channels;
    expect(ch.ok && ch.analysis.rms).toBe(analyzeChannel(Float64Array.from(values as number[]), FS).rms);
    expect(span.span.value!.cycles).toBe(10);
  });

  it('a span with a short overrange burst: figures of the longest valid stretch, never spliced across it', async () => {
    // Samples 1200–1499 invalid: the stretch before is 6 whole cycles. Joined to the samples after it, the
    // waveform would jump by half a cycle (1500 is 7.5 periods in) and show strong harmonics.
    const span = useSpanFigures(answering(mains(2000, 1200, 1500)));
    await span.measure(capture, 0, 0.2);
    const [ch] = span.span.value!.channels;
    if (!ch.ok) throw new Error(ch.reason);
    expect(ch.analysis.window.cycles).toBe(6);
    expect(ch.analysis.thdPercent!).toBeLessThan(0.1);
    expect(ch.analysis.warnings.map((w) => w.code)).toContain('invalidSamples');
  });

  it('a span mostly overrange: no figures, and the engine’s reason why', async () => {
    const span = useSpanFigures(answering(mains(600, 200, 500)));
    await span.measure(capture, 0, 0.06);
    const [ch] = span.span.value!.channels;
    expect(ch.ok).toBe(false);
    expect(!ch.ok && ch.reason).toMatch(/300 of 600 samples are empty or overrange, and the longest valid stretch \(200 samples\) is less than half the record/);
  });

  it('a min/max answer is refused with a message, not analysed as if it were samples', async () => {
    const fetch = vi.fn(async (): Promise<SamplesResponse> => ({ channel: 0, mode: 'minmax', t0S: 0, stepS: 0.01, startIndex: 0, sampleCount: 2000, min: [-1, -1], max: [1, 1] }));
    const span = useSpanFigures(fetch);
    await span.measure(capture, 0, 0.2);
    expect(span.span.value).toBeNull();
    expect(span.error.value).toMatch(/min\/max buckets.*figures need the samples themselves/);
  });

  it('a span longer than the browser may fetch asks nothing of the server', async () => {
    const fetch = answering([]);
    const span = useSpanFigures(fetch);
    await span.measure(capture, 0, (MAX_SPAN_SAMPLES + 10) / FS);
    expect(fetch).not.toHaveBeenCalled();
    expect(span.error.value).toMatch(/select at most 1,000,000/);
  });

  it('when two measurements overlap, the later one is shown even if the earlier answers last', async () => {
    let releaseFirst!: () => void;
    const slow = new Promise<void>((r) => (releaseFirst = r));
    const fetch = vi.fn(async (_id: number, q: SamplesQuery): Promise<SamplesResponse> => {
      if (q.toS === 0.2) await slow;
      const values = mains(Math.round((q.toS! - q.fromS!) * FS));
      return { channel: 0, mode: 'raw', t0S: q.fromS!, stepS: 1 / FS, startIndex: 0, sampleCount: values.length, values };
    });
    const span = useSpanFigures(fetch);
    const first = span.measure(capture, 0, 0.2);
    await span.measure(capture, 0, 0.1);
    releaseFirst();
    await first;
    expect(span.span.value!.toS).toBe(0.1);
    expect(span.busy.value).toBe(false);
  });
});
