import { CsvError } from './CsvError';

export type TextEncodingName = 'utf-8' | 'windows-1252' | 'utf-16le' | 'utf-16be';

export interface EncodingGuess {
  encoding: TextEncodingName;
  /** Bytes of byte-order mark to skip. */
  bomLength: number;
}

/**
 * The text encoding of a capture file from its first bytes: a BOM when there is one, else UTF-8 when
 * the head decodes as UTF-8, else Windows-1252 (older instruments write "µs" as the single byte 0xB5).
 * Bytes that no text file holds (NUL, most control codes) mean it is not a text export at all.
 */
export function detectEncoding(head: Uint8Array): EncodingGuess {
  if (head.length === 0) throw new CsvError('The file is empty.', undefined, 'empty');
  if (head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf) return { encoding: 'utf-8', bomLength: 3 };
  if (head[0] === 0xff && head[1] === 0xfe) return { encoding: 'utf-16le', bomLength: 2 };
  if (head[0] === 0xfe && head[1] === 0xff) return { encoding: 'utf-16be', bomLength: 2 };
  let control = 0;
  for (const b of head) {
    if (b === 0) throw new CsvError('This is not a text file: it holds binary data (NUL bytes). Export the capture as CSV.', undefined, 'not_text');
    if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) control++;
  }
  if (control > head.length * 0.01) {
    throw new CsvError('This is not a text file: it holds binary control codes. Export the capture as CSV.', undefined, 'not_text');
  }
  try {
    // A multi-byte character cut at the end of the head is not an error.
    new TextDecoder('utf-8', { fatal: true }).decode(head, { stream: true });
    return { encoding: 'utf-8', bomLength: 0 };
  } catch {
    return { encoding: 'windows-1252', bomLength: 0 };
  }
}
