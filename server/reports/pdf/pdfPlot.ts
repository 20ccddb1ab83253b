import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { formatSI } from '../../../shared/units';
import { niceTicks } from './niceTicks';
import type { ReportWriter } from './ReportWriter';

type Box = { x: number; y: number; width: number; height: number };

/** Points drawn per trace at most: a plot a few inches wide shows no more. */
export const MAX_POINTS = 2000;

/** One trace over time: sample values, or min/max per bucket; element i lies at t0S + i·stepS (a bucket's start). */
export interface Trace {
  label: string;
  color: string;
  t0S: number;
  stepS: number;
  values?: (number | null)[];
  min?: (number | null)[];
  max?: (number | null)[];
}

const AXIS = { size: 6.5, color: C.muted };

/** Legend swatches in a row at the top of the box; returns the height used. */
function legend(w: ReportWriter, box: Box, items: { label: string; color: string; dashed?: boolean }[]): number {
  let x = box.x + 46;
  for (const it of items) {
    const label = it.label.length > 60 ? `${it.label.slice(0, 59)}…` : it.label;
    w.doc.save().moveTo(x, box.y + 4).lineTo(x + 12, box.y + 4).lineWidth(2).strokeColor(it.color);
    if (it.dashed) w.doc.dash(2, { space: 1.5 });
    w.doc.stroke().undash().restore();
    w.text(label, { size: 7, color: C.text, width: 300 }, { x: x + 15, y: box.y });
    x += 15 + w.widthOf(label, { size: 7 }) + 14;
  }
  return 12;
}

function frame(w: ReportWriter, area: Box, xTicks: number[], yTicks: number[], X: (v: number) => number, Y: (v: number) => number, fx: (v: number) => string, fy: (v: number) => string) {
  const d = w.doc;
  d.save().lineWidth(0.4).strokeColor(C.rule);
  for (const t of yTicks) d.moveTo(area.x, Y(t)).lineTo(area.x + area.width, Y(t)).stroke();
  for (const t of xTicks) d.moveTo(X(t), area.y).lineTo(X(t), area.y + area.height).stroke();
  d.rect(area.x, area.y, area.width, area.height).lineWidth(0.6).strokeColor(C.muted).stroke().restore();
  for (const t of yTicks) w.text(fy(t), { ...AXIS, width: 42, align: 'right' }, { x: area.x - 46, y: Y(t) - 3 });
  for (const t of xTicks) w.text(fx(t), { ...AXIS, width: 60, align: 'center' }, { x: X(t) - 30, y: area.y + area.height + 3 });
}

function axisLabels(w: ReportWriter, box: Box, area: Box, xLabel: string, yLabel: string) {
  w.text(xLabel, { ...AXIS, width: area.width, align: 'center' }, { x: area.x, y: area.y + area.height + 13 });
  w.doc.save().rotate(-90, { origin: [box.x + 2, area.y + area.height] });
  w.text(yLabel, { ...AXIS, width: area.height, align: 'center' }, { x: box.x + 2, y: area.y + area.height });
  w.doc.restore();
}

/** Runs of consecutive non-null indices, so a gap of invalid samples breaks the line. */
function runs(values: (number | null)[]): [number, number][] {
  const out: [number, number][] = [];
  let start = -1;
  values.forEach((v, i) => {
    if (v !== null && start < 0) start = i;
    if ((v === null || i === values.length - 1) && start >= 0) {
      out.push([start, v === null ? i - 1 : i]);
      start = -1;
    }
  });
  return out;
}

/** Waveforms over time as vector paths: a line through samples, or a filled band between bucket minima and maxima. */
export function drawTimePlot(w: ReportWriter, box: Box, p: { traces: Trace[]; xRange: [number, number]; xLabel: string; yLabel: string; yUnit: string; xOrigin?: number }): void {
  const top = legend(w, box, p.traces);
  const area = { x: box.x + 50, y: box.y + top + 4, width: box.width - 56, height: box.height - top - 32 };
  const all = p.traces.flatMap((t) => [...(t.values ?? []), ...(t.min ?? []), ...(t.max ?? [])]).filter((v): v is number => v !== null);
  const y = niceTicks(Math.min(...all), Math.max(...all), 5);
  const [x0, x1] = p.xRange;
  const origin = p.xOrigin ?? 0;
  const xTicks = niceTicks(x0 - origin, x1 - origin, 6).ticks.filter((t) => t + origin >= x0 - 1e-12 && t + origin <= x1 + 1e-12);
  const X = (t: number) => area.x + ((t - x0) / (x1 - x0 || 1)) * area.width;
  const Y = (v: number) => area.y + area.height - ((v - y.min) / (y.max - y.min)) * area.height;
  frame(w, area, xTicks.map((t) => t + origin), y.ticks, X, Y, (t) => formatSI(t - origin, 's', 3), (v) => formatSI(v, p.yUnit, 3));
  const d = w.doc;
  d.save().rect(area.x, area.y, area.width, area.height).clip();
  for (const t of p.traces) {
    const at = (i: number) => X(t.t0S + (i + (t.values ? 0 : 0.5)) * t.stepS);
    if (t.values) {
      const stride = Math.max(1, Math.ceil(t.values.length / MAX_POINTS));
      const v = t.values.filter((_, i) => i % stride === 0);
      for (const [a, b] of runs(v)) {
        d.moveTo(at(a * stride), Y(v[a]!));
        for (let i = a + 1; i <= b; i++) d.lineTo(at(i * stride), Y(v[i]!));
        d.lineWidth(0.8).strokeColor(t.color).stroke();
      }
    } else if (t.min && t.max) {
      const lo = t.min.slice(0, MAX_POINTS);
      const hi = t.max.slice(0, MAX_POINTS);
      for (const [a, b] of runs(hi.map((v, i) => (v === null || lo[i] === null ? null : v)))) {
        d.moveTo(at(a), Y(hi[a]!));
        for (let i = a + 1; i <= b; i++) d.lineTo(at(i), Y(hi[i]!));
        for (let i = b; i >= a; i--) d.lineTo(at(i), Y(lo[i]!));
        d.closePath().lineWidth(0.5).fillOpacity(0.35).fillAndStroke(t.color, t.color).fillOpacity(1);
      }
    }
  }
  d.restore();
  axisLabels(w, box, area, p.xLabel, p.yLabel);
}

/** Harmonic bars (in % of the fundamental) with an optional limit mark over each order. */
export function drawBarPlot(w: ReportWriter, box: Box, p: { orders: number[]; values: (number | null)[]; limits?: (number | null)[]; color: string; label: string; limitLabel?: string }): void {
  const items = [{ label: p.label, color: p.color }, ...(p.limits ? [{ label: p.limitLabel ?? 'Limit', color: C.danger }] : [])];
  const top = legend(w, box, items);
  const area = { x: box.x + 50, y: box.y + top + 4, width: box.width - 56, height: box.height - top - 32 };
  const peak = Math.max(0, ...p.values.filter((v): v is number => v !== null), ...(p.limits ?? []).filter((v): v is number => v !== null));
  const y = niceTicks(0, peak || 1, 5);
  const first = Math.min(...p.orders) - 0.5;
  const last = Math.max(...p.orders) + 0.5;
  const X = (o: number) => area.x + ((o - first) / (last - first)) * area.width;
  const Y = (v: number) => area.y + area.height - ((v - y.min) / (y.max - y.min)) * area.height;
  const xTicks = p.orders.filter((o) => o === p.orders[0] || o % 5 === 0);
  frame(w, area, xTicks, y.ticks, X, Y, (o) => String(o), (v) => `${Number(v.toPrecision(3))} %`);
  const d = w.doc;
  const half = (0.7 / 2) * (area.width / (last - first));
  p.orders.forEach((o, i) => {
    const v = p.values[i];
    if (v !== null && v > 0) d.rect(X(o) - half, Y(v), 2 * half, area.y + area.height - Y(v)).fill(p.color);
  });
  p.limits?.forEach((l, i) => {
    if (l === null) return;
    const o = p.orders[i];
    d.moveTo(X(o) - half * 1.3, Y(l)).lineTo(X(o) + half * 1.3, Y(l)).lineWidth(1.2).strokeColor(C.danger).stroke();
  });
  axisLabels(w, box, area, 'Harmonic order', '% of the fundamental');
}
