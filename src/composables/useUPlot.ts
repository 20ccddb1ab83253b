import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { onBeforeUnmount, onMounted, ref, shallowRef, watch, type Ref } from 'vue';
import { useColorScheme } from './useColorScheme';

/** One plot to draw: uPlot's options without the size, which follows the host's width. */
export interface PlotSpec {
  options: Omit<uPlot.Options, 'width' | 'height'>;
  data: uPlot.AlignedData;
  /** Height in CSS pixels at the given width. */
  height: (width: number) => number;
}

/** Makes a plot; uPlot itself, except in tests of this composable, whose DOM has no canvas. */
export type PlotFactory = (options: uPlot.Options, data: uPlot.AlignedData, el: HTMLElement) => uPlot;

const createUPlot: PlotFactory = (options, data, el) => new uPlot(options, data, el);
let instances = 0;

/**
 * The one life cycle of Crestline's charts: `render()` draws the plots that `specs()` describes into
 * `host` (one below the other, cursors in sync), at the host's width; they follow its size, are drawn
 * again in the colours of a new light or dark scheme, and are destroyed with the component. `readout`
 * says in words what is under the cursor, for an aria-live region; `stepCursor` moves the cursor by keyboard.
 */
export function useUPlot(host: Ref<HTMLElement | null>, specs: () => PlotSpec[], opts: { create?: PlotFactory; readoutDelayMs?: number } = {}) {
  const create = opts.create ?? createUPlot;
  const plots = shallowRef<uPlot[]>([]);
  const readout = ref('');
  const syncKey = `crest-plot-${++instances}`;
  let heights: ((width: number) => number)[] = [];
  let observer: ResizeObserver | null = null;
  let readoutTimer: ReturnType<typeof setTimeout> | undefined;

  function describe(u: uPlot) {
    const i = u.cursor.idx;
    if (i == null) return;
    const text = (k: number) => {
      const s = u.series[k] as uPlot.Series & { value: (u: uPlot, v: number | null, k: number, i: number) => string | number };
      return String(s.value(u, u.data[k][i] ?? null, k, i));
    };
    const values = u.series.flatMap((s, k) => (k > 0 && s.show !== false ? [`${s.label}: ${text(k)}`] : []));
    clearTimeout(readoutTimer);
    // Settle before speaking: a cursor swept by a mouse would otherwise queue an announcement per pixel.
    readoutTimer = setTimeout(() => (readout.value = `${u.series[0].label} ${text(0)}. ${values.join(', ')}`), opts.readoutDelayMs ?? 250);
  }

  function destroy() {
    plots.value.forEach((u) => u.destroy());
    plots.value = [];
    if (host.value) host.value.replaceChildren();
  }

  function render() {
    destroy();
    const el = host.value;
    if (!el) return;
    // A chart in a hidden tab has no width yet; it is sized when the tab opens (see the observer).
    const width = el.clientWidth || 600;
    const list = specs();
    heights = list.map((s) => s.height);
    plots.value = list.map((spec) => {
      const box = document.createElement('div');
      el.appendChild(box);
      const hooks = spec.options.hooks ?? {};
      const u = create(
        {
          ...spec.options,
          width,
          height: spec.height(width),
          cursor: { ...spec.options.cursor, sync: { key: syncKey, setSeries: false } },
          hooks: { ...hooks, setCursor: [...(hooks.setCursor ?? []), describe] },
        },
        spec.data,
        box,
      );
      legendByKeyboard(u);
      return u;
    });
  }

  function resize() {
    const width = host.value?.clientWidth ?? 0;
    if (width > 0) plots.value.forEach((u, k) => (u.width !== width ? u.setSize({ width, height: heights[k]?.(width) ?? u.height }) : undefined));
  }

  /** Moves the cursor of every plot by `stride` points (the default: a fortieth of the plot) left or right. */
  function stepCursor(direction: -1 | 1, stride?: number) {
    const first = plots.value[0];
    const xs = first?.data[0];
    if (!first || !xs?.length) return;
    const step = stride ?? Math.max(1, Math.round(xs.length / 40));
    const from = first.cursor.idx ?? (direction > 0 ? -step : xs.length - 1 + step);
    const idx = Math.min(xs.length - 1, Math.max(0, from + direction * step));
    plots.value.forEach((u) => u.setCursor({ left: u.valToPos(xs[idx], 'x'), top: 10 }));
  }

  onMounted(() => {
    if (typeof ResizeObserver === 'undefined' || !host.value) return;
    observer = new ResizeObserver(resize);
    observer.observe(host.value);
  });
  onBeforeUnmount(() => {
    observer?.disconnect();
    clearTimeout(readoutTimer);
    destroy();
  });
  // Axis and grid colours are read from the theme when a plot is made, so a new scheme needs new plots.
  watch(useColorScheme().dark, render);

  return { plots, render, readout, stepCursor };
}

/** uPlot's legend toggles a series on click only; this makes each entry a toggle button for the keyboard too. */
function legendByKeyboard(u: uPlot) {
  const rows = [...u.root.querySelectorAll<HTMLElement>('.u-legend .u-series')];
  // The x series has a row only in a live legend.
  const offset = u.series.length - rows.length;
  const labels = rows.map((row, k) => ({ label: row.querySelector<HTMLElement>('th'), series: k + offset })).filter((l) => l.series > 0 && l.label);
  const showPressed = () => labels.forEach(({ label, series }) => label!.setAttribute('aria-pressed', String(u.series[series]?.show !== false)));
  for (const { label, series } of labels) {
    label!.tabIndex = 0;
    label!.setAttribute('role', 'button');
    // uPlot's own click handler was added first, so this one sees the new state.
    label!.addEventListener('click', showPressed);
    label!.addEventListener('keydown', (e) => {
      if (e.key !== 'Enter' && e.key !== ' ') return;
      e.preventDefault();
      e.stopPropagation();
      u.setSeries(series, { show: u.series[series]?.show === false });
      showPressed();
    });
  }
  showPressed();
}
