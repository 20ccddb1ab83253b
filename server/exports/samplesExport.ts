import { channelScalingOf, toEngineeringUnits } from '../../shared/channelScaling';
import type { CaptureChannel, CaptureDetail } from '../../shared/schemas/capture';
import type { SamplesExportQuery } from '../../shared/schemas/export';
import type { AppContext } from '../context';
import { readSamples } from '../services/sampleWindowService';
import { AppError } from '../errors';
import { csvLine, csvNumber, UTF8_BOM, type CsvDialect } from './csvWriter';

/** Samples per channel read and written at a time: 64 Ki keeps a block of text to a few MiB. */
const BLOCK = 65_536;
/** Stored samples are Float32: about 7 significant digits, and no more is printed. */
const SAMPLE_DIGITS = 7;

export interface SampleSpan {
  capture: CaptureDetail;
  startIndex: number;
  count: number;
  t0S: number;
  stepS: number;
}

/**
 * The samples whose times lie in [fromS, toS] (the whole record when absent). Refuses (400) an empty
 * span and one over `maxSamples` per channel, naming the limit, before anything is written.
 */
export function sampleSpan(capture: CaptureDetail, q: SamplesExportQuery, maxSamples: number): SampleSpan {
  const n = capture.sampleCount ?? 0;
  const stepS = 1 / (capture.sampleRate ?? 1);
  const t0S = capture.t0 ?? 0;
  // A hair of tolerance, so a sample printed at exactly fromS or toS is inside despite rounding.
  const i0 = q.fromS === undefined ? 0 : Math.max(0, Math.ceil((q.fromS - t0S) / stepS - 1e-6));
  const i1 = q.toS === undefined ? n : Math.min(n, Math.floor((q.toS - t0S) / stepS + 1e-6) + 1);
  const count = Math.max(0, i1 - i0);
  if (count === 0) throw new AppError(400, 'empty_span', 'The span holds no samples of this capture');
  if (count > maxSamples) {
    throw new AppError(400, 'span_too_long', `The span holds ${count.toLocaleString('en')} samples per channel; an export holds at most ${maxSamples.toLocaleString('en')} (EXPORT_MAX_SAMPLES). Choose a shorter span with fromS and toS.`);
  }
  return { capture, startIndex: i0, count, t0S: t0S + i0 * stepS, stepS };
}

async function block(ctx: AppContext, span: SampleSpan, channel: CaptureChannel, from: number, count: number): Promise<Float64Array> {
  return toEngineeringUnits(await readSamples(ctx, span.capture.id, channel.index, span.startIndex + from, count), channelScalingOf(channel));
}

const heads = (channels: CaptureChannel[]) => channels.map((c) => {
  const unit = channelScalingOf(c).unit;
  return unit ? `${c.name} (${unit})` : c.name;
});

/** samples.csv, block by block: a time column in seconds and one column per channel; invalid samples empty. */
export async function* samplesCsv(ctx: AppContext, span: SampleSpan, d: CsvDialect): AsyncGenerator<string> {
  const channels = span.capture.channels;
  yield (d.bom ? UTF8_BOM : '') + csvLine(['Time (s)', ...heads(channels)], d);
  for (let from = 0; from < span.count; from += BLOCK) {
    const n = Math.min(BLOCK, span.count - from);
    const columns: Float64Array[] = [];
    for (const c of channels) columns.push(await block(ctx, span, c, from, n));
    const lines = new Array<string>(n);
    for (let i = 0; i < n; i++) {
      let line = csvNumber(span.t0S + (from + i) * span.stepS, d);
      for (const col of columns) line += d.delimiter + csvNumber(col[i], d, SAMPLE_DIGITS);
      lines[i] = line;
    }
    yield lines.join('\r\n') + '\r\n';
  }
}

const jsonNumber = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(SAMPLE_DIGITS))) : 'null');

/** samples.json, block by block: the span's time base, then each channel's values (null where invalid). */
export async function* samplesJson(ctx: AppContext, span: SampleSpan): AsyncGenerator<string> {
  const { capture } = span;
  const head = { captureId: capture.id, name: capture.name, t0S: span.t0S, stepS: span.stepS, startIndex: span.startIndex, sampleCount: span.count };
  yield JSON.stringify(head).slice(0, -1) + ',"channels":[';
  for (const [k, c] of capture.channels.entries()) {
    yield `${k ? ',' : ''}${JSON.stringify({ index: c.index, name: c.name, unit: channelScalingOf(c).unit }).slice(0, -1)},"values":[`;
    for (let from = 0; from < span.count; from += BLOCK) {
      const values = await block(ctx, span, c, from, Math.min(BLOCK, span.count - from));
      yield (from ? ',' : '') + Array.from(values, jsonNumber).join(',');
    }
    yield ']}';
  }
  yield ']}';
}
