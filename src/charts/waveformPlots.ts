import type uPlot from 'uplot';
import type { CaptureChannel } from '../../shared/schemas/capture';
import type { PlotSpec } from '../composables/useUPlot';
import { axis, CHANNEL_COLOURS } from './chartTheme';
import type { XYSeries } from './samplesSeries';

/** Plot heights in CSS pixels: lower on a phone, where the chart must leave room for the figures. */
const overlayHeight = (width: number) => (width < 600 ? 240 : 360);
const stackedHeight = (channels: number) => (width: number) => Math.max(width < 600 ? 120 : 160, Math.floor((width < 600 ? 300 : 420) / channels));

/**
 * The plots of a capture's waveform: every channel in one plot with an axis per unit ('overlay'), or a
 * plot per channel ('stacked'). `hooks` carry the caller's band drawing and selection.
 */
export function waveformPlots(channels: CaptureChannel[], series: XYSeries[], layout: 'overlay' | 'stacked', hooks: uPlot.Hooks.Arrays): PlotSpec[] {
  const groups = layout === 'overlay' ? [channels.map((_, i) => i)] : channels.map((_, i) => [i]);
  return groups.map((members) => {
    const units = [...new Set(members.map((i) => channels[i].unit || '—'))];
    return {
      height: layout === 'overlay' ? overlayHeight : stackedHeight(channels.length),
      data: [series[members[0]].x, ...members.map((i) => series[i].y)] as uPlot.AlignedData,
      options: {
        scales: { x: { time: false }, ...Object.fromEntries(units.map((u) => [u, { auto: true }])) },
        axes: [axis('Time (s)'), ...units.map((u, k) => axis(u, u, k === 0 ? 3 : 1))],
        series: [
          { label: 't (s)', value: (_u, v) => (v == null ? '—' : v.toPrecision(7)) },
          ...members.map((i) => ({
            label: `${channels[i].name} (${channels[i].unit || '—'})`,
            scale: channels[i].unit || '—',
            stroke: CHANNEL_COLOURS[i % CHANNEL_COLOURS.length],
            width: 1.25,
            spanGaps: false,
            value: (_u: uPlot, v: number | null) => (v == null ? '—' : v.toPrecision(5)),
          })),
        ],
        cursor: { drag: { x: true, y: false, setScale: false } },
        select: { show: true, left: 0, top: 0, width: 0, height: 0 },
        legend: { live: true },
        hooks,
      },
    };
  });
}
