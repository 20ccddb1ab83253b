// @vitest-environment happy-dom
import { flushPromises } from '@vue/test-utils';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { analyzeChannel } from '../../../../shared/analysis';
import type { AnalysisResponse, CaptureDetail, SamplesQuery, SamplesResponse } from '../../../../shared/schemas/capture';
import * as capturesApi from '../../../../src/api/captures';
import * as comparisonsApi from '../../../../src/api/comparisons';
import { useComparison } from '../../../../src/composables/useComparison';
import { withSetup } from '../harness';

vi.mock('../../../../src/api/captures');
vi.mock('../../../../src/api/comparisons');

const FS = 10_000;
const wave = (peak: number, n = 800) => Array.from({ length: n }, (_, i) => peak * Math.sin(2 * Math.PI * 50 * (i / FS)));
const analysisOf = (peak: number) => analyzeChannel(Float64Array.from(wave(peak, 2000)), FS);
const channel = (index: number, name: string, unit: string) => ({ index, name, unit, invalidCount: 0 });
const captures: Record<number, CaptureDetail> = {
  1: { id: 1, name: 'before', t0: 0, durationS: 0.2, channels: [channel(0, 'U', 'V')] } as CaptureDetail,
  2: { id: 2, name: 'after', t0: 0, durationS: 0.2, channels: [channel(0, 'U', 'V'), channel(1, 'I', 'A')] } as CaptureDetail,
};
const analyses: Record<number, AnalysisResponse> = {
  1: { engineVersion: 1, channels: [analysisOf(325)], systems: [], voltageEvents: [] },
  2: { engineVersion: 1, channels: [analysisOf(300), analysisOf(10)], systems: [], voltageEvents: [] },
};

/** Capture 1 answers with its samples; capture 2 (more samples than asked for) with min/max buckets. */
function samples(id: number, q: SamplesQuery): SamplesResponse {
  const values = wave(id === 1 ? 325 : q.channel === 0 ? 300 : 10);
  const base = { channel: q.channel, t0S: q.fromS ?? 0, stepS: 1 / FS, startIndex: 0, sampleCount: values.length };
  if (id === 1) return { ...base, mode: 'raw', values };
  return { ...base, mode: 'minmax', stepS: 2 / FS, min: values.filter((_, i) => i % 2 === 0), max: values.filter((_, i) => i % 2 === 1) };
}

beforeEach(() => {
  vi.mocked(capturesApi.listCaptures).mockResolvedValue({ items: [], total: 0, page: 1, pageSize: 200 });
  vi.mocked(capturesApi.getCapture).mockImplementation(async (id) => captures[id]);
  vi.mocked(capturesApi.getAnalysis).mockImplementation(async (id) => analyses[id]);
  vi.mocked(capturesApi.getSamples).mockImplementation(async (id, q) => samples(id, q));
});
afterEach(() => {
  vi.clearAllMocks();
  document.body.innerHTML = '';
});

async function compared(ids = [1, 2]) {
  const setup = withSetup(() => useComparison(undefined, ids));
  await flushPromises();
  return setup;
}

describe('useComparison', () => {
  it('fetches each capture once and aligns one channel of each on a common time grid', async () => {
    const { result } = await compared();
    expect(capturesApi.getCapture).toHaveBeenCalledTimes(2);
    expect(result.items.value.map((it) => `${it.capture.name} ${it.channel.name}`)).toEqual(['before U', 'after U']);
    const t = result.traces.value!;
    expect(t.traces.map((tr) => tr.label)).toEqual(['before · U', 'after · U']);
    expect(t.x).toHaveLength(1200);
    expect(t.xLabel).toMatch(/first rising zero crossing/);
  });

  it('draws a min/max answer as an envelope rather than nothing', async () => {
    const { result } = await compared();
    const [raw, envelope] = result.traces.value!.traces;
    expect(raw.hi).toBeNull();
    expect(envelope.hi).not.toBeNull();
    expect(envelope.lo.filter((v) => v !== null).length).toBeGreaterThan(1000);
  });

  it('a new layout fetches nothing; a new channel fetches the samples of that capture only', async () => {
    const { result } = await compared();
    const asked = vi.mocked(capturesApi.getSamples).mock.calls.length;
    result.settings.value.layout = 'stacked';
    await flushPromises();
    expect(capturesApi.getSamples).toHaveBeenCalledTimes(asked);
    result.setChannel(1, 1);
    await flushPromises();
    expect(vi.mocked(capturesApi.getSamples).mock.calls.slice(asked).map(([id, q]) => [id, q.channel])).toEqual([[2, 1]]);
    expect(result.traces.value!.traces[1].label).toBe('after · I');
    expect(capturesApi.getCapture).toHaveBeenCalledTimes(2);
  });

  it('tabulates the figures side by side with differences to the first capture', async () => {
    const { result } = await compared();
    const rms = result.rows.value.find((r) => r.key === 'rms')!;
    // 325 and 300 V peak: 229.8 and 212.1 V RMS, 17.68 V (7.7 %) apart (x/√2, standard calculus).
    expect(rms.cells.map((c) => c.text)).toEqual(['229.8 V', '212.1 V']);
    expect(rms.cells[1].difference).toBe('-17.68 V (-7.7 %)');
    expect(result.spectra.value.map((s) => s.label)).toEqual(['before', 'after']);
  });

  it('saves the comparison and opens it', async () => {
    vi.mocked(comparisonsApi.saveComparison).mockResolvedValue({ id: 9, name: 'Before and after', captureIds: [1, 2], settings: { align: 'zeroCrossing', layout: 'overlay', channels: [] }, createdBy: null, createdAt: '' });
    const { result, router } = await compared();
    await result.save('Before and after');
    await flushPromises();
    expect(comparisonsApi.saveComparison).toHaveBeenCalledWith({ name: 'Before and after', captureIds: [1, 2], settings: { align: 'zeroCrossing', layout: 'overlay', channels: [] } });
    expect(router.currentRoute.value.fullPath).toBe('/comparisons/9');
  });
});
