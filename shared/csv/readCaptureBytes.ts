import { CaptureReader, type CaptureData } from './CaptureReader';
import { detectEncoding } from './detectEncoding';
import type { ReadLimits } from './readLimits';

/** Bytes examined to tell the encoding and to refuse binary files. */
export const ENCODING_PROBE_BYTES = 64 * 1024;

/** What readCaptureBytes is told besides the bytes. */
export interface ReadCaptureOptions {
  /** Samples per second, for a file that has neither a time column nor an interval in its preamble. */
  sampleRateHint?: number | null;
  /** Size of the whole file in bytes (an estimate will do), to size the columns once. */
  totalBytes?: number;
  /** Limits on the size of what is read; DEFAULT_READ_LIMITS where not given. */
  limits?: Partial<ReadLimits>;
}

export type CaptureBytesData = CaptureData & { encoding: string; bom: boolean };

/**
 * Reads a capture from its bytes pushed in order, in chunks of any size, as they arrive (from disk, or
 * from an upload still streaming in). The first chunk tells the encoding: UTF-16 is transcoded to
 * UTF-8, so that one byte-level reader serves every encoding. Throws a CsvError naming the line;
 * `too_large` when the file goes over one of the limits, as soon as it shows.
 */
export class CaptureByteStream {
  private reader: CaptureReader | null = null;
  private transcode: { decoder: TextDecoder; encoder: TextEncoder } | null = null;
  private bom = false;
  private encoding = '';
  /** The first bytes, held until there are enough to tell the encoding whatever the chunk sizes. */
  private probe: Uint8Array[] = [];
  private probeBytes = 0;

  constructor(private readonly options: ReadCaptureOptions = {}) {}

  push(chunk: Uint8Array): void {
    if (this.reader) return this.feed(chunk);
    this.probe.push(chunk);
    this.probeBytes += chunk.length;
    if (this.probeBytes >= ENCODING_PROBE_BYTES) this.start();
  }

  /** Ends the input; a sample rate given here replaces the one given at the start. */
  finish(sampleRateHint = this.options.sampleRateHint): CaptureBytesData {
    if (!this.reader) this.start();
    if (this.transcode) this.reader!.pushBytes(this.transcode.encoder.encode(this.transcode.decoder.decode()));
    return { ...this.reader!.finish(sampleRateHint), encoding: this.encoding, bom: this.bom };
  }

  private start(): void {
    const first = this.probe.length === 1 ? this.probe[0] : joinBytes(this.probe, this.probeBytes);
    this.probe = [];
    // An empty file gets detectEncoding's error.
    const guess = detectEncoding(first.subarray(0, ENCODING_PROBE_BYTES));
    this.bom = guess.bomLength > 0;
    this.encoding = guess.encoding;
    const ascii = guess.encoding === 'utf-8' || guess.encoding === 'windows-1252';
    if (!ascii) this.transcode = { decoder: new TextDecoder(guess.encoding, { ignoreBOM: true }), encoder: new TextEncoder() };
    const { sampleRateHint, totalBytes, limits } = this.options;
    this.reader = new CaptureReader({ sampleRateHint, expectedChars: totalBytes, limits, encoding: ascii ? (guess.encoding as 'utf-8' | 'windows-1252') : 'utf-8' });
    this.feed(first.subarray(guess.bomLength));
  }

  private feed(bytes: Uint8Array): void {
    this.reader!.pushBytes(this.transcode ? this.transcode.encoder.encode(this.transcode.decoder.decode(bytes, { stream: true })) : bytes);
  }
}

/**
 * Reads a capture from its bytes, given as one buffer or as chunks in order (the worker streams them).
 * Throws a CsvError naming the line; `too_large` when the file goes over one of the limits.
 */
export function readCaptureBytes(chunks: Iterable<Uint8Array>, options: ReadCaptureOptions = {}): CaptureBytesData {
  const stream = new CaptureByteStream(options);
  for (const chunk of chunks) stream.push(chunk);
  return stream.finish();
}

function joinBytes(parts: Uint8Array[], total: number): Uint8Array {
  const out = new Uint8Array(total);
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}
