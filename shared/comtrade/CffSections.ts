import { ComtradeError } from './ComtradeError';

/** The sections of a 2013 combined file (.cff) up to its data. */
export interface CffHead {
  /** The CFG section's text and the file line of its first line. */
  cfgText: string;
  cfgFirstLine: number;
  /** How the DAT section line names the data: ASCII, or binary with its byte count (null when not given). */
  data: { kind: 'ASCII' } | { kind: 'BINARY'; bytes: number | null };
  /** File line and byte offset where the data starts. */
  dataLine: number;
  dataOffset: number;
}

const latin1 = new TextDecoder('latin1');

/**
 * A section line, `--- file type: CFG ---` or `--- file type: DAT BINARY: 123456 ---` (2013 edition,
 * CFF clause; layout from memory): returns the words after "file type:", upper-cased, or null.
 */
function sectionName(line: string): string | null {
  const t = line.trim();
  if (!t.startsWith('---') || !t.endsWith('---') || t.length < 7) return null;
  const inner = t.slice(3, -3).trim();
  if (!inner.toLowerCase().startsWith('file type:')) return null;
  return inner.slice('file type:'.length).trim().toUpperCase();
}

/**
 * Gathers the head of a .cff (its CFG, INF and HDR sections) from byte chunks until the DAT section
 * line, within `maxHeadBytes`, and hands back the bytes after that line as the start of the data.
 */
export class CffSections {
  private buffer = new Uint8Array(0);
  private scanned = 0;
  private line = 0;
  private cfg: { from: number; to: number; line: number } | null = null;

  constructor(
    private readonly file: string,
    private readonly maxHeadBytes: number,
  ) {}

  /** Feeds a chunk; returns the head and the first data bytes once the DAT line has been seen. */
  push(chunk: Uint8Array): { head: CffHead; rest: Uint8Array } | null {
    const joined = new Uint8Array(this.buffer.length + chunk.length);
    joined.set(this.buffer);
    joined.set(chunk, this.buffer.length);
    this.buffer = joined;
    for (;;) {
      const nl = this.buffer.indexOf(10, this.scanned);
      if (nl < 0) break;
      // A byte-order mark may open the file.
      const bom = this.scanned === 0 && this.buffer[0] === 0xef && this.buffer[1] === 0xbb && this.buffer[2] === 0xbf ? 3 : 0;
      const text = latin1.decode(this.buffer.subarray(this.scanned + bom, Math.min(nl, this.scanned + 200)));
      const from = this.scanned;
      this.scanned = nl + 1;
      this.line++;
      const name = sectionName(text);
      if (name === null) continue;
      if (this.cfg && this.cfg.to < 0) this.cfg.to = from;
      if (name === 'CFG') this.cfg = { from: nl + 1, to: -1, line: this.line + 1 };
      else if (name.startsWith('DAT')) return { head: this.head(name), rest: this.buffer.subarray(nl + 1) };
    }
    if (this.buffer.length > this.maxHeadBytes) {
      throw new ComtradeError({ file: this.file, line: this.line + 1 }, `no "--- file type: DAT … ---" line in the first ${this.maxHeadBytes.toLocaleString('en-US')} bytes: is this a COMTRADE combined file?`);
    }
    return null;
  }

  private head(name: string): CffHead {
    if (!this.cfg) throw new ComtradeError({ file: this.file, line: this.line }, 'the data section comes before any "--- file type: CFG ---" section.');
    const kind = name.slice(3).trim();
    let data: CffHead['data'];
    if (kind === 'ASCII') data = { kind: 'ASCII' };
    else if (kind.startsWith('BINARY')) {
      const count = kind.slice('BINARY'.length).replace(':', '').trim();
      const bytes = count === '' ? null : Number(count);
      if (bytes !== null && !(Number.isInteger(bytes) && bytes >= 0)) throw new ComtradeError({ file: this.file, line: this.line }, `the data section's byte count "${count.slice(0, 20)}" is not a whole number.`);
      data = { kind: 'BINARY', bytes };
    } else throw new ComtradeError({ file: this.file, line: this.line }, `unknown data section "${name.slice(0, 40)}": expected DAT ASCII or DAT BINARY.`);
    // The DAT line closed the CFG section if nothing else did.
    const cfgText = new TextDecoder('utf-8').decode(this.buffer.subarray(this.cfg.from, this.cfg.to));
    return { cfgText, cfgFirstLine: this.cfg.line, data, dataLine: this.line + 1, dataOffset: this.scanned };
  }

  /** The error for a file that ended before its DAT line. */
  ended(): ComtradeError {
    return new ComtradeError({ file: this.file, line: this.line + 1 }, 'the file ends before a "--- file type: DAT ASCII ---" or "--- file type: DAT BINARY: n ---" section.');
  }
}
