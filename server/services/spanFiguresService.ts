import { asc, eq } from 'drizzle-orm';
import type { SpanFiguresQuery, SpanFiguresResponse } from '../../shared/schemas/spanFigures';
import type { AppContext } from '../context';
import { channels } from '../db/schema';
import { findCaptureRow } from '../db/captureRepository';
import { AppError, notFound } from '../errors';
import { readSamples } from './sampleWindowService';

/** Time allowed to the figures of one span (1 M samples take about 0.2 s a channel). */
const SPAN_FIGURES_BUDGET_MS = 30_000;

/**
 * The engine's figures of every channel over a span, computed on the server from the stored samples
 * in a worker thread. Both places were measured: here, 1 M samples × 2 channels answer in about 250 ms
 * with a few kB sent (`npm run bench`); the browser's Web Worker (src/figures) runs the same engine on
 * the binary samples it already holds for the chart, which is what the workspace uses for the spans a
 * person measures. This route serves API clients and spans longer than the browser holds.
 */
export async function spanFigures(ctx: AppContext, captureId: number, q: SpanFiguresQuery): Promise<SpanFiguresResponse> {
  const capture = await findCaptureRow(ctx.db, captureId);
  if (!capture) throw notFound('Capture');
  if (capture.status !== 'ready') throw new AppError(409, 'not_ready', `The capture is ${capture.status}; its figures are not ready yet`);
  const n = capture.sampleCount ?? 0;
  const rate = capture.sampleRate ?? 1;
  const t0 = capture.t0 ?? 0;
  const i0 = Math.min(n, Math.max(0, q.fromS === undefined ? 0 : Math.ceil((q.fromS - t0) * rate - 1e-9)));
  const i1 = Math.min(n, Math.max(i0, q.toS === undefined ? n : Math.floor((q.toS - t0) * rate + 1e-9)));
  const count = i1 - i0;
  const list = await ctx.db.select({ idx: channels.idx }).from(channels).where(eq(channels.captureId, captureId)).orderBy(asc(channels.idx));
  const limit = ctx.config.SPAN_FIGURES_MAX_SAMPLES;
  if (count * list.length > limit) {
    throw new AppError(400, 'span_too_long', `The span holds ${(count * list.length).toLocaleString('en-US')} samples over all channels; span figures take at most ${limit.toLocaleString('en-US')} (SPAN_FIGURES_MAX_SAMPLES). Choose a shorter span.`);
  }
  if (count < 2) throw new AppError(400, 'span_too_short', 'The span holds fewer than 2 samples.');
  const spans = await Promise.all(list.map((c) => readSamples(ctx, captureId, c.idx, i0, count)));
  const results = await ctx.spanWorkers.spanFigures({ channels: spans, sampleRate: rate, t0: t0 + i0 / rate }, SPAN_FIGURES_BUDGET_MS);
  return {
    fromS: t0 + i0 / rate,
    toS: t0 + i1 / rate,
    sampleCount: count,
    channels: results.map((r, k) => ({ index: list[k].idx, analysis: r.ok ? r.analysis : null, reason: r.ok ? null : r.reason })),
  };
}
