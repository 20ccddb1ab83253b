import { parentPort } from 'node:worker_threads';
import { CsvError } from '../../shared/csv';
import { ingestFile, type IngestRequest } from './ingestTask';

export type IngestReply =
  | { id: number; ok: true; result: ReturnType<typeof ingestFile> }
  | { id: number; ok: false; error: { code: string; message: string; line?: number } };

parentPort!.on('message', ({ id, request }: { id: number; request: IngestRequest }) => {
  try {
    const result = ingestFile(request);
    const transfer = result.channels.flatMap((c) => [...c.chunks.map((b) => b.buffer), ...c.overviews.map((o) => o.data.buffer)]);
    parentPort!.postMessage({ id, ok: true, result } satisfies IngestReply, [...new Set(transfer)] as ArrayBuffer[]);
  } catch (e) {
    const error =
      e instanceof CsvError
        ? { code: e.code, message: e.message, ...(e.line !== undefined ? { line: e.line } : {}) }
        : { code: 'internal', message: e instanceof Error ? e.message : String(e) };
    parentPort!.postMessage({ id, ok: false, error } satisfies IngestReply);
  }
});
