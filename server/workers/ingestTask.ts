import { closeSync, openSync, readSync } from 'node:fs';
import { analyzeValidSpan, ENGINE_VERSION, findAnomalies, type AnomalySuggestion } from '../../shared/analysis';
import { CsvError } from '../../shared/csv';
import { readCaptureBytes } from '../../shared/csv/readCaptureBytes';
import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { DetectedFormat } from '../../shared/schemas/capture';
import { float32Chunks, overviewPyramid } from '../services/samplePacking';

export interface IngestRequest {
  file: string;
  sizeBytes: number;
  sampleRateHint: number | null;
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

export interface IngestResult {
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

/** Reads, analyses and packs one capture file. CPU-bound: runs in a worker thread. */
export function ingestFile(req: IngestRequest): IngestResult {
  const data = readCaptureBytes(fileChunks(req.file), { sampleRateHint: req.sampleRateHint, totalBytes: req.sizeBytes });
  const layout = data.layout;
  const channels = data.channels.map((c, i): IngestedChannel => {
    const result = analyzeValidSpan(c.samples, data.sampleRate, { t0: data.t0 });
    if (!result.ok) throw new CsvError(`Channel ${c.name}: ${result.reason}`, c.firstInvalidLine ?? undefined);
    return {
      name: c.name || `CH${i + 1}`,
      unit: c.unit,
      invalidCount: c.invalidCount,
      analysis: result.analysis,
      suggestions: findAnomalies(c.samples, data.sampleRate, data.t0, result.analysis.frequency),
      chunks: float32Chunks(c.samples),
      overviews: overviewPyramid(c.samples).map((l) => ({ bucketSize: l.bucketSize, data: Buffer.from(l.minMax.buffer) })),
    };
  });
  return {
    sampleRate: data.sampleRate,
    sampleCount: data.rows,
    t0: data.t0,
    engineVersion: ENGINE_VERSION,
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
  };
}
