import { closeSync, openSync, readSync } from 'node:fs';
import { analyzeValidSpan, findAnomalies, type AnomalySuggestion } from '../../shared/analysis';
import { CsvError } from '../../shared/csv';
import { readCaptureBytes } from '../../shared/csv/readCaptureBytes';
import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { DetectedFormat } from '../../shared/schemas/capture';
import { float32Chunks, overviewPyramid } from '../services/samplePacking';
import { parseComtrade, type ComtradeFiles, type FileExtras } from './parseComtrade';

export interface IngestRequest {
  file: string;
  sizeBytes: number;
  sampleRateHint: number | null;
  /** Bounds on what the reader accepts (rows × channels from the server's memory setting). */
  limits?: { maxSamples?: number };
  /** Set for a COMTRADE record: `file` is its .cfg (with `dataFile`) or its .cff (without). */
  comtrade?: ComtradeFiles;
}

export interface IngestedChannel {
  name: string;
  unit: string;
  invalidCount: number;
  analysis: ChannelAnalysis;
  suggestions: AnomalySuggestion[];
  chunks: Buffer[];
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
}

/** Reads one capture file into channels of samples. CPU-bound: runs in a worker thread. */
export function parseFile(req: IngestRequest): ParsedFile {
  if (req.comtrade) return parseComtrade(req, req.comtrade, fileChunks);
  const t0 = performance.now();
  const data = readCaptureBytes(fileChunks(req.file), { sampleRateHint: req.sampleRateHint, totalBytes: req.sizeBytes });
  if (process.env.CRESTLINE_TRACE) console.log(`  reading ${(performance.now() - t0).toFixed(0)} ms`);
  const layout = data.layout;
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
    channels: data.channels.map((c, i) => ({ name: c.name || `CH${i + 1}`, unit: c.unit, invalidCount: c.invalidCount, firstInvalidLine: c.firstInvalidLine, samples: c.samples })),
  };
}

export interface AnalyseRequest {
  channel: ParsedChannel;
  sampleRate: number;
  t0: number;
}

/** Analyses one channel, looks for anomalies and packs its samples for storage. Runs in a worker thread. */
export function analyseChannel(req: AnalyseRequest): IngestedChannel {
  const t0 = performance.now();
  const c = req.channel;
  const result = analyzeValidSpan(c.samples, req.sampleRate, { t0: req.t0 });
  if (!result.ok) throw new CsvError(`Channel ${c.name}: ${result.reason}`, c.firstInvalidLine ?? undefined);
  const out = {
    name: c.name,
    unit: c.unit,
    invalidCount: c.invalidCount,
    analysis: result.analysis,
    suggestions: findAnomalies(c.samples, req.sampleRate, req.t0, result.analysis.frequency),
    chunks: float32Chunks(c.samples),
    overviews: overviewPyramid(c.samples).map((l) => ({ bucketSize: l.bucketSize, data: Buffer.from(l.minMax.buffer) })),
  };
  if (process.env.CRESTLINE_TRACE) console.log(`  channel ${c.name}: analysis and packing ${(performance.now() - t0).toFixed(0)} ms`);
  return out;
}
