import { CaptureByteStream, type ReadCaptureOptions } from '../../shared/csv/readCaptureBytes';
import type { IngestRequest, ParsedFile } from './ingestTask';
import { parsedCsv } from './ingestTask';

/** What the reading of an upload is told when it opens: its expected size and the limits. */
export type StreamOpenOptions = Pick<ReadCaptureOptions, 'totalBytes' | 'limits'>;

/** Messages that feed a CSV to a worker while it is still being uploaded. They have no reply. */
export type StreamMessage =
  | { stream: number; open: StreamOpenOptions }
  | { stream: number; chunk: Uint8Array }
  | { stream: number; drop: true };

/** What a worker tells of a stream as it reads it: the bytes read so far. */
export interface StreamProgress {
  stream: number;
  consumed: number;
}

/** A worker reports its progress on a stream after every this many bytes. */
const PROGRESS_EVERY_BYTES = 4 * 1024 * 1024;

/** The task that ends a stream: the capture's setup, known once the upload is stored. */
export interface StreamParseRequest extends Pick<IngestRequest, 'sampleRateHint' | 'channelSetup' | 'systems'> {
  stream: number;
}

interface OpenStream {
  reading: CaptureByteStream | null;
  /** The first error; later chunks are not read (the upload still completes, and the capture fails with it). */
  error: unknown;
  startedAt: number;
  consumed: number;
  reported: number;
}

/** The worker's side: the streams it is reading, by id. */
export class UploadStreams {
  private streams = new Map<number, OpenStream>();

  constructor(private readonly report: (progress: StreamProgress) => void) {}

  handle(m: StreamMessage): void {
    if ('open' in m) {
      this.streams.set(m.stream, { reading: new CaptureByteStream(m.open), error: null, startedAt: performance.now(), consumed: 0, reported: 0 });
      return;
    }
    if ('drop' in m) {
      this.streams.delete(m.stream);
      return;
    }
    const s = this.streams.get(m.stream);
    if (!s) return;
    try {
      s.reading?.push(m.chunk);
    } catch (err) {
      s.error = err;
      s.reading = null;
    }
    s.consumed += m.chunk.length;
    if (s.consumed - s.reported >= PROGRESS_EVERY_BYTES) {
      s.reported = s.consumed;
      this.report({ stream: m.stream, consumed: s.consumed });
    }
  }

  /** Ends a stream: the file as parseFile would have read it from disk, or the error it met. */
  parse(req: StreamParseRequest): ParsedFile {
    const s = this.streams.get(req.stream);
    this.streams.delete(req.stream);
    if (!s) throw new Error(`upload stream ${req.stream} is not open in this worker`);
    if (!s.reading) throw s.error;
    const data = s.reading.finish(req.sampleRateHint);
    if (process.env.CRESTLINE_TRACE) console.log(`  read while uploading, finished ${(performance.now() - s.startedAt).toFixed(0)} ms after the first byte`);
    return parsedCsv(data, req);
  }
}
