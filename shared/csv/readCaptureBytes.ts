import { CaptureReader, type CaptureData } from './CaptureReader';
import { detectEncoding } from './detectEncoding';

/** Bytes examined to tell the encoding and to refuse binary files. */
export const ENCODING_PROBE_BYTES = 64 * 1024;

/** Reads a capture from its bytes, given as one buffer or as chunks in order (the worker streams them). */
export function readCaptureBytes(chunks: Iterable<Uint8Array>, options: { sampleRateHint?: number | null; totalBytes?: number } = {}): CaptureData & { encoding: string; bom: boolean } {
  let decoder: TextDecoder | null = null;
  let bom = false;
  let encoding = '';
  const reader = new CaptureReader({ sampleRateHint: options.sampleRateHint, expectedChars: options.totalBytes });
  for (const chunk of chunks) {
    let bytes = chunk;
    if (!decoder) {
      const guess = detectEncoding(bytes.subarray(0, ENCODING_PROBE_BYTES));
      decoder = new TextDecoder(guess.encoding, { ignoreBOM: true });
      bom = guess.bomLength > 0;
      encoding = guess.encoding;
      bytes = bytes.subarray(guess.bomLength);
    }
    reader.push(decoder.decode(bytes, { stream: true }));
  }
  if (!decoder) detectEncoding(new Uint8Array(0));
  reader.push(decoder!.decode());
  return { ...reader.finish(), encoding, bom };
}
