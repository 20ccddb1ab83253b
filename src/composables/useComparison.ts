import { computed, onMounted, ref, shallowRef, watch } from 'vue';
import { useRouter } from 'vue-router';
import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { AnalysisResponse, CaptureChannel, CaptureDetail, CaptureSummary, SamplesResponse } from '../../shared/schemas/capture';
import type { ComparisonSettings } from '../../shared/schemas/comparison';
import * as capturesApi from '../api/captures';
import * as comparisonsApi from '../api/comparisons';
import { alignedTraces, type AlignedTrace } from '../charts/alignedCycles';
import { comparisonRows } from '../figures/comparisonRows';
import { useAsync } from './useAsync';
import { to } from '../router';

/** Cycles of each capture drawn on the common time grid. */
export const CYCLES_SHOWN = 3;
/** Samples asked for per capture: enough for the samples themselves at usual rates; beyond, an envelope. */
export const COMPARISON_POINTS = 20_000;

export interface ComparedItem {
  capture: CaptureDetail;
  channel: CaptureChannel;
  analysis: ChannelAnalysis;
}

export interface ComparisonTraces {
  x: number[];
  traces: (AlignedTrace & { label: string })[];
  xLabel: string;
  unit: string;
}

/**
 * The data of a comparison: the captures picked (or saved), one channel of each, their samples aligned
 * on one time grid, the figures side by side and the spectra. Each capture is fetched once; a new channel
 * or alignment fetches samples again, while layout and theme are the view's business and fetch nothing.
 */
export function useComparison(comparisonId?: number, initialIds: number[] = []) {
  const { run, loading } = useAsync();
  const router = useRouter();
  const options = ref<CaptureSummary[]>([]);
  const ids = ref<number[]>([]);
  const settings = ref<ComparisonSettings>({ align: 'zeroCrossing', layout: 'overlay', channels: [] });
  const savedName = ref('');
  const loaded = shallowRef(new Map<number, { detail: CaptureDetail; analysis: AnalysisResponse }>());
  const traces = shallowRef<ComparisonTraces | null>(null);
  const samples = new Map<string, Promise<SamplesResponse | undefined>>();
  let traceSeq = 0;

  const channelOf = (k: number, d: CaptureDetail) => Math.min(settings.value.channels[k] ?? 0, d.channels.length - 1);
  const items = computed<ComparedItem[]>(() =>
    ids.value.flatMap((id, k) => {
      const e = loaded.value.get(id);
      if (!e) return [];
      const ch = channelOf(k, e.detail);
      return [{ capture: e.detail, channel: e.detail.channels[ch], analysis: e.analysis.channels[ch] }];
    }),
  );
  const rows = computed(() => comparisonRows(items.value.map((it) => ({ analysis: it.analysis, unit: it.channel.unit }))));
  const spectra = computed(() => items.value.map((it) => ({ label: it.capture.name, unit: it.channel.unit, harmonics: it.analysis.harmonics })));

  async function loadCaptures() {
    const missing = ids.value.filter((id) => !loaded.value.has(id));
    const got = await Promise.all(missing.map((id) => Promise.all([run(() => capturesApi.getCapture(id)), run(() => capturesApi.getAnalysis(id))])));
    if (!got.length) return;
    const next = new Map(loaded.value);
    got.forEach(([detail, analysis], k) => detail && analysis && next.set(missing[k], { detail, analysis }));
    loaded.value = next;
  }

  function samplesOnce(id: number, channel: number, fromS: number, toS: number) {
    const key = `${id}/${channel}/${fromS}/${toS}`;
    if (!samples.has(key)) {
      const answer = run(() => capturesApi.getSamples(id, { channel, fromS, toS, points: COMPARISON_POINTS }));
      // A failed request is not remembered, so that the next change of settings asks again.
      samples.set(key, answer.then((r) => (r ?? void samples.delete(key))));
    }
    return samples.get(key)!;
  }

  /** Three cycles of each capture from its first rising zero crossing (or from the trigger, t = 0), on one time grid. */
  async function loadTraces() {
    const list = items.value;
    const seq = ++traceSeq;
    if (list.length < 2) return void (traces.value = null);
    const align = settings.value.align;
    const periods = list.map((it) => (it.analysis.frequency ? 1 / it.analysis.frequency : null));
    const span = CYCLES_SHOWN * Math.max(...periods.map((p, k) => p ?? (list[k].capture.durationS ?? 0) / 10));
    const windows = list.map((it, k) => {
      const t0 = it.capture.t0 ?? 0;
      const fromS = align === 'trigger' ? Math.max(0, t0) : t0;
      return { fromS, toS: fromS + span + (periods[k] ?? 0) * 1.2 };
    });
    const answers = await Promise.all(list.map((it, k) => samplesOnce(it.capture.id, it.channel.index, windows[k].fromS, windows[k].toS)));
    if (seq !== traceSeq) return;
    if (answers.some((a) => !a)) return void (traces.value = null);
    const aligned = alignedTraces(answers.map((s, k) => ({ samples: s!, fromS: windows[k].fromS })), align, span);
    traces.value = {
      x: aligned.x,
      traces: aligned.traces.map((t, k) => ({ ...t, label: `${list[k].capture.name} · ${list[k].channel.name}` })),
      xLabel: align === 'zeroCrossing' ? 'Time from the first rising zero crossing (s)' : 'Time from the trigger (s)',
      unit: list[0].channel.unit,
    };
  }

  function setChannel(k: number, channel: number) {
    const next = [...settings.value.channels];
    while (next.length <= k) next.push(0);
    next[k] = channel;
    settings.value.channels = next;
  }

  async function save(name: string) {
    const c = await run(() => comparisonsApi.saveComparison({ name, captureIds: ids.value, settings: settings.value }), { success: 'Comparison saved' });
    if (c) await router.push(to('comparison', { id: c.id }));
  }

  watch(ids, async () => {
    await loadCaptures();
    await loadTraces();
  }, { deep: true });
  watch(() => [settings.value.align, settings.value.channels.join()], loadTraces);

  onMounted(async () => {
    const list = await run(() => capturesApi.listCaptures({ status: 'ready', pageSize: 200 }));
    if (list) options.value = list.items;
    if (comparisonId) {
      const c = await run(() => comparisonsApi.getComparison(comparisonId));
      if (!c) return;
      savedName.value = c.name;
      settings.value = c.settings;
      ids.value = c.captureIds;
    } else ids.value = initialIds.slice(0, 4);
  });

  return { options, ids, settings, savedName, items, traces, rows, spectra, loading, setChannel, save };
}
