import { parentPort } from 'node:worker_threads';
import { ComtradeError } from '../../shared/comtrade';
import { CsvError } from '../../shared/csv';
import { analyseChannel, parseFile, spanFigures, withStoredSamples, type AnalyseRequest, type IngestRequest, type SpanFiguresRequest } from './ingestTask';
import { UploadStreams, type StreamMessage, type StreamParseRequest } from './uploadReading';

export type IngestTask =
  | { kind: 'parse'; request: IngestRequest }
  | { kind: 'streamParse'; request: StreamParseRequest }
  | { kind: 'analyse'; request: AnalyseRequest } | { kind: 'figures'; request: SpanFiguresRequest };

export type IngestReply = { id: number; ok: true; result: unknown } | { id: number; ok: false; error: { code: string; message: string; line?: number } };

const streams = new UploadStreams((progress) => parentPort!.postMessage(progress));

parentPort!.on('message', (message: { id: number; task: IngestTask } | StreamMessage) => {
  if ('stream' in message) return streams.handle(message);
  const { id, task } = message;
  try {
    let result: unknown;
    let transfer: ArrayBufferLike[];
    if (task.kind === 'parse' || task.kind === 'streamParse') {
      const parsed = withStoredSamples(task.kind === 'parse' ? parseFile(task.request) : streams.parse(task.request));
      result = parsed;
      transfer = [...parsed.channels.map((c) => c.samples.buffer), ...parsed.stored!.flat().map((b) => b.buffer)];
    } else if (task.kind === 'figures') {
      result = spanFigures(task.request);
      transfer = [];
    } else {
      const channel = analyseChannel(task.request);
      result = channel;
      transfer = channel.overviews.map((o) => o.data.buffer);
    }
    // Samples and packed chunks move to the main thread rather than being copied.
    parentPort!.postMessage({ id, ok: true, result } satisfies IngestReply, [...new Set(transfer)] as ArrayBuffer[]);
  } catch (e) {
    const error =
      e instanceof CsvError || e instanceof ComtradeError
        ? { code: e.code, message: e.message, ...(e.line !== undefined ? { line: e.line } : {}) }
        : { code: 'internal', message: e instanceof Error ? e.message : String(e) };
    parentPort!.postMessage({ id, ok: false, error } satisfies IngestReply);
  }
});

// Tells the pool that the code is loaded, so a task's time budget does not include start-up.
parentPort!.postMessage({ ready: true });
