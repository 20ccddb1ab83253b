import { cycleTrend, thinTrend } from '../../shared/analysis';
import type { TrendQuery, TrendResponse } from '../../shared/schemas/powerQuality';
import type { AppContext } from '../context';
import { trendSource } from '../db/captureSetupRepository';
import { AppError, notFound } from '../errors';
import { readSamples } from './sampleWindowService';

/** At most this many samples are read for one trend (80 MB of Float32): a longer record is asked for by spans. */
export const MAX_TREND_SAMPLES = 20_000_000;

/**
 * A channel's values from cycle to cycle (Urms(1/2), RMS per cycle or frequency per cycle) over a
 * span, from the stored samples, at most `points` values (thinned keeping each bucket's lowest and
 * highest, so a dip survives). Only the span and one nominal cycle either side are read: the windows
 * start on the zero crossings found there, which are the record's own.
 */
export async function channelTrend(ctx: AppContext, captureId: number, q: TrendQuery): Promise<TrendResponse> {
  const src = await trendSource(ctx.db, captureId, q.channel);
  if (!src) throw notFound('Capture');
  if (src.status !== 'ready') throw new AppError(409, 'not_ready', `The capture is ${src.status}; its samples are not ready yet`);
  if (src.channel === null) throw notFound(`Channel ${q.channel}`);
  const unit = q.kind === 'frequencyCycle' ? 'Hz' : (src.unit ?? '');
  const frequency = src.frequency === null || src.frequency === 'null' ? null : Number(src.frequency);
  const n = src.sampleCount ?? 0;
  const rate = src.sampleRate ?? 1;
  const t0 = src.t0 ?? 0;
  if (!frequency || n < 2) return { channel: q.channel, kind: q.kind, unit, total: 0, points: [] };
  const margin = Math.ceil(rate / frequency);
  const first = q.fromS === undefined ? 0 : Math.max(0, Math.floor((q.fromS - t0) * rate) - margin);
  const last = q.toS === undefined ? n : Math.min(n, Math.ceil((q.toS - t0) * rate) + margin + 1);
  if (last - first > MAX_TREND_SAMPLES) {
    throw new AppError(422, 'span_too_long', `A trend covers at most ${MAX_TREND_SAMPLES.toLocaleString('en')} samples; ask for a shorter span (fromS, toS)`);
  }
  if (last - first < 2) return { channel: q.channel, kind: q.kind, unit, total: 0, points: [] };
  const samples = await readSamples(ctx, captureId, q.channel, first, last - first);
  const all = cycleTrend(samples, rate, frequency, q.kind, t0 + first / rate);
  const span = all.filter((p) => (q.fromS === undefined || p.tS >= q.fromS) && (q.toS === undefined || p.tS <= q.toS));
  return { channel: q.channel, kind: q.kind, unit, total: span.length, points: thinTrend(span, q.points) };
}
