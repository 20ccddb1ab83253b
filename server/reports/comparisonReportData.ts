import { envelopeAt, firstRisingCrossing } from '../../shared/reports/alignedCycles';
import { CHANNEL_COLOURS } from '../../shared/reports/palette';
import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { CaptureChannel, CaptureDetail } from '../../shared/schemas/capture';
import type { Comparison } from '../../shared/schemas/comparison';
import type { AppContext } from '../context';
import { findProject } from '../db/projectRepository';
import { getComparison } from '../services/comparisonService';
import { readyCapture } from '../services/readyCapture';
import { sampleWindow } from '../services/sampleWindowService';
import type { ReportAuthor } from './captureReportData';
import type { Trace } from './pdf/pdfPlot';

/** Cycles overlaid, and points per overlaid trace: as the comparison page draws them. */
const CYCLES_SHOWN = 3;
const OVERLAY_POINTS = 600;

export interface ComparedCapture {
  capture: CaptureDetail;
  channel: CaptureChannel;
  analysis: ChannelAnalysis;
  projectName: string | null;
}

export interface ComparisonReportData {
  comparison: Comparison;
  items: ComparedCapture[];
  overlay: { traces: Trace[]; spanS: number };
  author: ReportAuthor;
  generatedAt: Date;
}

/**
 * Three cycles of each capture's compared channel from its first rising zero crossing (or from the
 * trigger), resampled onto one time grid, as the comparison page overlays them.
 */
async function overlay(ctx: AppContext, items: ComparedCapture[], align: Comparison['settings']['align']) {
  const periods = items.map((it) => (it.analysis.frequency ? 1 / it.analysis.frequency : null));
  const spanS = CYCLES_SHOWN * Math.max(...periods.map((p, k) => p ?? (items[k].capture.durationS ?? 0) / 10));
  const stepS = spanS / (OVERLAY_POINTS - 1);
  const traces: Trace[] = [];
  for (const [k, it] of items.entries()) {
    const t0 = it.capture.t0 ?? 0;
    const from = align === 'trigger' ? Math.max(0, t0) : t0;
    const s = await sampleWindow(ctx, it.capture.id, { channel: it.channel.index, fromS: from, toS: from + spanS + (periods[k] ?? 0) * 1.2, points: 200_000 });
    const start = align === 'zeroCrossing' ? (firstRisingCrossing(s) ?? from) : from;
    const values = Array.from({ length: OVERLAY_POINTS }, (_, i) => {
      const e = envelopeAt(s, start + i * stepS);
      return e === null ? null : (e.lo + e.hi) / 2;
    });
    traces.push({ label: `${it.capture.name} · ${it.channel.name}`, color: CHANNEL_COLOURS[k % CHANNEL_COLOURS.length], t0S: 0, stepS, values });
  }
  return { traces, spanS };
}

/** Everything a comparison report shows: 404 for an unknown comparison, 409 while one of its captures is not ready. */
export async function comparisonReportData(ctx: AppContext, comparisonId: number, author: ReportAuthor): Promise<ComparisonReportData> {
  const comparison = await getComparison(ctx, comparisonId);
  const items: ComparedCapture[] = [];
  for (const [k, id] of comparison.captureIds.entries()) {
    const { detail, analyses } = await readyCapture(ctx, id);
    const idx = Math.min(comparison.settings.channels[k] ?? 0, detail.channels.length - 1);
    items.push({ capture: detail, channel: detail.channels[idx], analysis: analyses[idx], projectName: (await findProject(ctx.db, detail.projectId))?.name ?? null });
  }
  return { comparison, items, overlay: await overlay(ctx, items, comparison.settings.align), author, generatedAt: new Date() };
}
