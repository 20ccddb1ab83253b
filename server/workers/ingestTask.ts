import { closeSync, openSync, readSync } from 'node:fs';
import { analyzeValidSpan, channelVoltageEvents, findAnomalies, findClipping, sampleRange, threePhaseSystems, type AnomalySuggestion, type ValidSpanResult } from '../../shared/analysis';
import { CsvError, type ReadLimits } from '../../shared/csv';
import { CaptureByteStream, type CaptureBytesData } from '../../shared/csv/readCaptureBytes';
import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { DetectedFormat } from '../../shared/schemas/capture';
import type { ChannelSetup } from '../../shared/schemas/channelSetup';
import type { ChannelVoltageEvents } from '../../shared/schemas/powerQuality';
import type { SystemSpec, ThreePhaseSystem } from '../../shared/schemas/threePhase';
import { float32Chunks, overviewPyramid } from '../services/samplePacking';
import { inEngineeringUnits } from './engineeringUnits';

import { parseComtrade, type ComtradeFiles, type FileExtras } from './parseComtrade';

/** The declared supply voltage in V, and whether the capture or its project set it. */
export type Declared = { value: number; from: 'capture' | 'project' } | null;

export interface IngestRequest {
  file: string;
  sizeBytes: number;
  sampleRateHint: number | null;
  /** Bounds on what the reader accepts (rows × channels from the server's memory setting). */
  limits?: Partial<ReadLimits>;
  /** Applied to the values read, before analysis. */
  channelSetup?: ChannelSetup[];
  /** Three-phase sets a user stated; null or absent: found automatically. */
  systems?: SystemSpec[] | null;
  declared?: Declared;
  /** Set for a COMTRADE record: `file` is its .cfg (with `dataFile`) or its .cff (without). */
  comtrade?: ComtradeFiles;
}

export interface IngestedChannel {
  name: string;
  unit: string;
  invalidCount: number;
  analysis: ChannelAnalysis;
  suggestions: AnomalySuggestion[];
  /** Dips, swells and interruptions of a voltage channel, or null. */
  voltageEvents: Omit<ChannelVoltageEvents, 'channel'> | null;
  overviews: { bucketSize: number; data: Buffer }[];
}

export interface IngestResult extends FileExtras {
  sampleRate: number;
  sampleCount: number;
  t0: number;
  engineVersion: number;
  detected: DetectedFormat;
  metadata: { key: string; value: string; line: number }[];
  channels: IngestedChannel[];
  systems: ThreePhaseSystem[];
}

const READ_CHUNK = 4 * 1024 * 1024;

function* fileChunks(path: string): Generator<Uint8Array> {
  const fd = openSync(path, 'r');
  try {
    for (;;) {
      const buf = Buffer.allocUnsafe(READ_CHUNK);
      const n = readSync(fd, buf, 0, READ_CHUNK, null);
      if (n === 0) return;
      yield buf.subarray(0, n);
    }
  } finally {
    closeSync(fd);
  }
}

export interface ParsedChannel {
  name: string;
  unit: string;
  invalidCount: number;
  firstInvalidLine: number | null;
  samples: Float64Array;
}

export interface ParsedFile extends FileExtras {
  sampleRate: number;
  sampleCount: number;
  t0: number;
  detected: DetectedFormat;
  metadata: { key: string; value: string; line: number }[];
  channels: ParsedChannel[];
  systems: ThreePhaseSystem[];
}

/**
 * Reads one capture file into channels of samples in engineering units, and analyses its three-phase
 * systems (they need several channels at once). CPU-bound: runs in a worker thread.
 */
export function parseFile(req: IngestRequest): ParsedFile {
  if (req.comtrade) {
    const record = parseComtrade(req, req.comtrade, fileChunks);
    const channels = inEngineeringUnits(record.channels, req.channelSetup);
    return { ...record, channels, systems: threePhaseSystems(channels, record.sampleRate, record.t0, req.systems ?? null) };
  }
  const t0 = performance.now();
  const stream = new CaptureByteStream({ totalBytes: req.sizeBytes, limits: req.limits });
  for (const chunk of fileChunks(req.file)) stream.push(chunk);
  const data = stream.finish(req.sampleRateHint);
  if (process.env.CRESTLINE_TRACE) console.log(`  reading ${(performance.now() - t0).toFixed(0)} ms`);
  return parsedCsv(data, req);
}

/** What a CSV read from disk, or while it was uploaded, becomes once the capture's setup is applied. */
export function parsedCsv(data: CaptureBytesData, req: Pick<IngestRequest, 'channelSetup' | 'systems'>): ParsedFile {
  const layout = data.layout;
  const read = data.channels.map((c, i) => ({ name: c.name || `CH${i + 1}`, unit: c.unit, invalidCount: c.invalidCount, firstInvalidLine: c.firstInvalidLine, samples: c.samples }));
  const channels = inEngineeringUnits(read, req.channelSetup);
  return {
    sampleRate: data.sampleRate,
    sampleCount: data.rows,
    t0: data.t0,
    detected: {
      encoding: data.encoding,
      bom: data.bom,
      lineEnding: data.lineEnding,
      delimiter: layout.delimiter === '\t' ? 'tab' : layout.delimiter,
      decimal: layout.decimal,
      headerLine: layout.headerLine,
      unitsLine: layout.unitsLine,
      dataStartLine: layout.dataStartLine,
      timeColumn: layout.timeColumn !== null ? `${layout.columns[layout.timeColumn].name} (${layout.columns[layout.timeColumn].unit})` : null,
      timeSource: data.timeSource,
      timeDeviationSamples: data.timeDeviation,
      rows: data.rows,
    },
    metadata: layout.preamble,
    channels,
    systems: threePhaseSystems(channels, data.sampleRate, data.t0, req.systems ?? null),
  };
}

export interface AnalyseRequest {
  channel: ParsedChannel;
  sampleRate: number;
  t0: number;
  declared?: Declared;
}

/** Analyses one channel, looks for anomalies and builds its overview pyramid. Runs in a worker thread. */
export function analyseChannel(req: AnalyseRequest): IngestedChannel {
  const t0 = performance.now();
  const c = req.channel;
  // One range and clipping search serves the analysis warnings and the anomaly finder (about 10 ms per 1 M samples).
  const range = sampleRange(c.samples);
  const clipping = findClipping(c.samples, 0, c.samples.length, range.min, range.max);
  const result = analyzeValidSpan(c.samples, req.sampleRate, { t0: req.t0, clipping });
  if (!result.ok) throw new CsvError(`Channel ${c.name}: ${result.reason}`, c.firstInvalidLine ?? undefined);
  const events = channelVoltageEvents(c.samples, req.sampleRate, req.t0, c.unit, result.analysis.frequency, req.declared ?? null);
  const out = {
    name: c.name,
    unit: c.unit,
    invalidCount: c.invalidCount,
    analysis: result.analysis,
    suggestions: [...findAnomalies(c.samples, req.sampleRate, req.t0, result.analysis.frequency, { clipping, range }), ...(events?.suggestions ?? [])],
    voltageEvents: events?.found ?? null,
    overviews: overviewPyramid(c.samples).map((l) => ({ bucketSize: l.bucketSize, data: Buffer.from(l.minMax.buffer) })),
  };
  if (process.env.CRESTLINE_TRACE) console.log(`  channel ${c.name}: analysis and packing ${(performance.now() - t0).toFixed(0)} ms`);
  return out;
}

export interface SpanFiguresRequest {
  /** One span per channel, as stored (Float32), in the channel's unit. */
  channels: Float32Array[];
  sampleRate: number;
  t0: number;
}

/** The engine's figures of each channel over a span, under its valid-span rules (no splicing across gaps). */
export function spanFigures(req: SpanFiguresRequest): ValidSpanResult[] {
  return req.channels.map((samples) => analyzeValidSpan(Float64Array.from(samples), req.sampleRate, { t0: req.t0 }));
}

/** A read capture, with each channel's samples also packed as stored (Float32 chunks). */
export type ReadCapture = ParsedFile & { stored: Buffer[][] };

/** Packs each channel's samples as they are stored, beside the Float64 ones the analysis takes. */
export function withStoredSamples(parsed: ParsedFile): ReadCapture {
  return { ...parsed, stored: parsed.channels.map((c) => float32Chunks(c.samples)) };
}
