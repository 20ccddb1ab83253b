// @vitest-environment happy-dom
import type uPlot from 'uplot';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { nextTick, ref } from 'vue';
import { useColorScheme } from '../../../../src/composables/useColorScheme';
import { useUPlot, type PlotFactory, type PlotSpec } from '../../../../src/composables/useUPlot';
import { withSetup } from '../harness';

/**
 * A stand-in for uPlot, whose canvas the test DOM cannot draw: it keeps what it was given and what was
 * asked of it, and builds a legend the way uPlot does (a row per series, the label in a <th>).
 */
class FakePlot {
  destroyed = false;
  sizes: { width: number; height: number }[] = [];
  cursors: { left: number; top: number }[] = [];
  shown: boolean[];
  root = document.createElement('div');
  cursor: { idx: number | null } = { idx: null };
  series: { label: string; show: boolean; value: (u: unknown, v: number | null) => string }[];
  constructor(
    readonly opts: uPlot.Options,
    readonly data: uPlot.AlignedData,
    el: HTMLElement,
  ) {
    this.series = opts.series.map((s) => ({ label: String(s.label), show: true, value: (_u, v) => (v == null ? '—' : `${v} units`) }));
    this.shown = this.series.map(() => true);
    this.root.innerHTML = `<table class="u-legend">${this.series.map((s) => `<tr class="u-series"><th>${s.label}</th><td></td></tr>`).join('')}</table>`;
    el.appendChild(this.root);
  }
  get width() {
    return this.opts.width;
  }
  get height() {
    return this.opts.height;
  }
  destroy = () => (this.destroyed = true);
  setSize = (s: { width: number; height: number }) => this.sizes.push(s);
  valToPos = (v: number) => v * 100;
  setCursor = (c: { left: number; top: number }) => this.cursors.push(c);
  setSeries = (i: number, o: { show: boolean }) => (this.series[i].show = o.show);
  /** What uPlot does when the cursor moves: its hooks run. */
  moveTo(idx: number) {
    this.cursor.idx = idx;
    this.opts.hooks?.setCursor?.forEach((h) => h?.(this as unknown as uPlot));
  }
}

function setup(specs: PlotSpec[]) {
  const made: FakePlot[] = [];
  const create: PlotFactory = (o, d, el) => {
    const p = new FakePlot(o, d, el);
    made.push(p);
    return p as unknown as uPlot;
  };
  const host = ref<HTMLElement | null>(document.createElement('div'));
  const { result, wrapper } = withSetup(() => useUPlot(host, () => specs, { create, readoutDelayMs: 0 }));
  return { made, host, plot: result, wrapper };
}
const spec = (height: number): PlotSpec => ({ height: (w) => (w < 500 ? height / 2 : height), data: [[0, 1, 2], [5, 6, 7]], options: { series: [{ label: 't (s)' }, { label: 'CH1 (V)' }] } });

afterEach(() => {
  document.body.innerHTML = '';
  vi.unstubAllGlobals();
});

describe('useUPlot', () => {
  it('draws one plot per spec, one below the other, with their cursors in sync', () => {
    const { made, host, plot } = setup([spec(300), spec(200)]);
    plot.render();
    expect(made).toHaveLength(2);
    expect(host.value!.children).toHaveLength(2);
    // The test DOM has no layout: a host without width is drawn 600 px wide until it is sized.
    expect(made.map((p) => [p.opts.width, p.opts.height])).toEqual([[600, 300], [600, 200]]);
    const keys = made.map((p) => p.opts.cursor?.sync?.key);
    expect(keys[0]).toBeTruthy();
    expect(keys[1]).toBe(keys[0]);
  });

  it('drawing again replaces the plots, destroying the old ones', () => {
    const { made, host, plot } = setup([spec(300)]);
    plot.render();
    plot.render();
    expect(made.map((p) => p.destroyed)).toEqual([true, false]);
    expect(host.value!.children).toHaveLength(1);
  });

  it('follows the host’s width, with the height the spec gives for it', () => {
    let notify!: () => void;
    vi.stubGlobal('ResizeObserver', class { constructor(cb: () => void) { notify = cb; } observe() {} disconnect() {} });
    const { made, host, plot } = setup([spec(300)]);
    plot.render();
    Object.defineProperty(host.value!, 'clientWidth', { value: 390 });
    notify();
    expect(made[0].sizes).toEqual([{ width: 390, height: 150 }]);
  });

  it('draws again in the colours of a new scheme', async () => {
    const { made, plot } = setup([spec(300)]);
    plot.render();
    useColorScheme().toggle();
    await nextTick();
    expect(made).toHaveLength(2);
    expect(made[0].destroyed).toBe(true);
    useColorScheme().toggle();
  });

  it('is destroyed with its component', () => {
    const { made, plot, wrapper } = setup([spec(300)]);
    plot.render();
    wrapper.unmount();
    expect(made[0].destroyed).toBe(true);
  });

  it('reads out what is under the cursor, in the series’ own formats', async () => {
    const { made, plot } = setup([spec(300)]);
    plot.render();
    made[0].moveTo(1);
    await vi.waitFor(() => expect(plot.readout.value).toBe('t (s) 1 units. CH1 (V): 6 units'));
  });

  it('moves the cursor of every plot by keyboard, from the start and by a given stride', () => {
    const { made, plot } = setup([spec(300), spec(200)]);
    plot.render();
    plot.stepCursor(1, 1);
    expect(made.map((p) => p.cursors.at(-1)!.left)).toEqual([0, 0]);
    made.forEach((p) => (p.cursor.idx = 0));
    plot.stepCursor(1, 2);
    expect(made[0].cursors.at(-1)!.left).toBe(200);
  });

  it('makes each legend entry a toggle button for the keyboard', () => {
    const { made, host, plot } = setup([spec(300)]);
    plot.render();
    const label = host.value!.querySelectorAll('th')[1] as HTMLElement;
    expect(label.getAttribute('role')).toBe('button');
    expect(label.tabIndex).toBe(0);
    expect(label.getAttribute('aria-pressed')).toBe('true');
    label.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    expect(made[0].series[1].show).toBe(false);
    expect(label.getAttribute('aria-pressed')).toBe('false');
    // The x series is no toggle.
    expect(host.value!.querySelectorAll('th')[0].getAttribute('role')).toBeNull();
  });
});
