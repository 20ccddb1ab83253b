import { CaptureReader, type CaptureData } from './CaptureReader';
import { detectEncoding } from './detectEncoding';
import type { ReadLimits } from './readLimits';

/** Bytes examined to tell the encoding and to refuse binary files. */
export const ENCODING_PROBE_BYTES = 64 * 1024;

/** What readCaptureBytes is told besides the bytes. */
export interface ReadCaptureOptions {
  /** Samples per second, for a file that has neither a time column nor an interval in its preamble. */
  sampleRateHint?: number | null;
  /** Size of the whole file in bytes, to size the columns once. */
  totalBytes?: number;
  /** Limits on the size of what is read; DEFAULT_READ_LIMITS where not given. */
  limits?: Partial<ReadLimits>;
}

/**
 * Reads a capture from its bytes, given as one buffer or as chunks in order (the worker streams them).
 * Throws a CsvError naming the line; `too_large` when the file goes over one of the limits.
 */
export function readCaptureBytes(chunks: Iterable<Uint8Array>, options: ReadCaptureOptions = {}): CaptureData & { encoding: string; bom: boolean } {
  let reader: CaptureReader | null = null;
  // UTF-16 is transcoded to UTF-8, so that one byte-level reader serves every encoding.
  let transcode: { decoder: TextDecoder; encoder: TextEncoder } | null = null;
  let bom = false;
  let encoding = '';
  for (const chunk of chunks) {
    let bytes = chunk;
    if (!reader) {
      const guess = detectEncoding(bytes.subarray(0, ENCODING_PROBE_BYTES));
      bom = guess.bomLength > 0;
      encoding = guess.encoding;
      bytes = bytes.subarray(guess.bomLength);
      const ascii = guess.encoding === 'utf-8' || guess.encoding === 'windows-1252';
      if (!ascii) transcode = { decoder: new TextDecoder(guess.encoding, { ignoreBOM: true }), encoder: new TextEncoder() };
      reader = new CaptureReader({ sampleRateHint: options.sampleRateHint, expectedChars: options.totalBytes, limits: options.limits, encoding: ascii ? (guess.encoding as 'utf-8' | 'windows-1252') : 'utf-8' });
    }
    reader.pushBytes(transcode ? transcode.encoder.encode(transcode.decoder.decode(bytes, { stream: true })) : bytes);
  }
  if (!reader) detectEncoding(new Uint8Array(0));
  if (transcode) reader!.pushBytes(transcode.encoder.encode(transcode.decoder.decode()));
  return { ...reader!.finish(), encoding, bom };
}
