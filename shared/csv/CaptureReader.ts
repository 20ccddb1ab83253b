import { CsvError } from './CsvError';
import { excerpt } from './excerpt';
import { GrowableColumn } from './GrowableColumn';
import { readByteNumber, type ByteNumber } from './byteNumber';
import { HeadWindow, type Head } from './HeadWindow';
import { cellTooLong, dataLineTooLong, tooManySamples } from './limitErrors';
import { cellValue } from './numberCells';
import { resolveReadLimits, type ReadLimits } from './readLimits';
import { sniffLayout, type CaptureLayout } from './sniffLayout';
import { timeBaseFromColumn } from './timeBase';

export interface ChannelData {
  name: string;
  unit: string;
  samples: Float64Array;
  /** Empty, NaN or overrange cells, stored as NaN. */
  invalidCount: number;
  firstInvalidLine: number | null;
}

export interface CaptureData {
  layout: CaptureLayout;
  lineEnding: 'LF' | 'CRLF' | 'CR';
  rows: number;
  sampleRate: number;
  t0: number;
  timeSource: 'column' | 'preamble' | 'given';
  /** Largest distance of a printed time from the steady grid, in samples (0 without a time column). */
  timeDeviation: number;
  channels: ChannelData[];
}

const HEAD_LINES = 400;
/** 10^0 … 10^15, exact doubles. */
const POW10 = Array.from({ length: 16 }, (_, i) => Number(`1e${i}`));
/** Bytes decoded at a time while the head window fills. */
const HEAD_SLICE_BYTES = 64 * 1024;

/** What a CaptureReader is told besides the text. */
export interface CaptureReaderOptions {
  /** Samples per second, for a file that has neither a time column nor an interval in its preamble. */
  sampleRateHint?: number | null;
  /** Length of the whole file, to size the columns once (bytes will do). */
  expectedChars?: number;
  /** Limits on the size of what is read; DEFAULT_READ_LIMITS where not given. */
  limits?: Partial<ReadLimits>;
  /**
   * For `pushBytes`: the text encoding of the bytes, which must keep ASCII as single bytes (UTF-8 or
   * Windows-1252; transcode UTF-16 first). Used for the head and for the rare lines read with care.
   */
  encoding?: 'utf-8' | 'windows-1252';
}

const lineNumbers = (length: number) => new Uint32Array(length);

/**
 * Reads a capture export pushed as text chunks of any size: the first lines decide the layout
 * (csv-parse handles their quoting), then a fast path of our own reads the numeric body. Going over one
 * of the ReadLimits throws a `too_large` CsvError as soon as it shows, before the memory is taken.
 *
 * Measured on a 27 MB, 1 M-row, 3-column export on this machine: csv-parse with cast:true reads about
 * 20 MB/s; this reader about 90 MB/s, against about 165 MB/s for a bare indexOf + Number() loop that
 * checks nothing (`npm run bench -- --part=engine --quick` prints all three). On a 1 GiB export that is
 * 12 s instead of 55.
 */
export class CaptureReader {
  private readonly limits: ReadLimits;
  private readonly window: HeadWindow;
  /** Rows that fit the sample budget: maxSamples over the channel count. */
  private maxRows = Infinity;
  private carry = '';
  private layout: CaptureLayout | null = null;
  private lineBreak = '\n';
  private lineEnding: CaptureData['lineEnding'] = 'LF';
  private line = 0;
  private columns: GrowableColumn[] = [];
  /** The file line of each row, for messages: Uint32 (a file of 4 G lines is far past every limit) halves it. */
  private rowLines = new GrowableColumn(16, Infinity, lineNumbers);
  private invalid: number[] = [];
  private firstInvalid: (number | null)[] = [];
  private rowCount = 0;
  private rowValues = new Float64Array(0);
  private decimalCode = 46;
  /** Byte mode: the head's bytes until the layout is known, then the start of an unfinished line. */
  private headBytes: Uint8Array[] = [];
  private byteCarry: Uint8Array = new Uint8Array(0);
  private readonly byteText: TextDecoder;
  private readonly number: ByteNumber = { value: 0, end: 0 };

  constructor(private readonly options: CaptureReaderOptions = {}) {
    this.limits = resolveReadLimits(options.limits);
    this.window = new HeadWindow(this.limits.maxHeadBytes, HEAD_LINES);
    this.byteText = new TextDecoder(options.encoding ?? 'utf-8');
  }

  /** Feeds the next piece of the decoded file. */
  push(text: string): void {
    if (this.layout) this.consume(text, false);
    else if (this.window.add(text)) this.startBody(false);
  }

  /**
   * Feeds the next bytes of the file (after any byte-order mark), in the encoding given to the
   * constructor. The numeric body is read from the bytes themselves: no string per cell or per line.
   */
  pushBytes(bytes: Uint8Array): void {
    this.byteMode = true;
    if (this.layout) this.consumeBytes(bytes, false);
    else {
      this.headBytes.push(bytes);
      // Only as much is decoded as the head window takes, in slices: never a whole 4 MB chunk.
      for (let at = 0; at < bytes.length; at += HEAD_SLICE_BYTES) {
        if (this.window.add(this.byteText.decode(bytes.subarray(at, at + HEAD_SLICE_BYTES), { stream: true }))) return this.startBodyFromBytes(false);
      }
    }
  }

  /**
   * Ends the input and returns the capture, or throws a CsvError naming the line. A sample rate given
   * here replaces the constructor's: a file read while it is uploaded may be told it only at the end.
   */
  finish(sampleRateHint = this.options.sampleRateHint): CaptureData {
    if (this.byteMode) {
      if (!this.layout) {
        this.window.add(this.byteText.decode());
        this.startBodyFromBytes(true);
      }
      this.consumeBytes(new Uint8Array(0), true);
    } else {
      if (!this.layout) this.startBody(true);
      this.consume('', true);
    }
    return this.result(sampleRateHint);
  }

  private byteMode = false;

  /** Sniffs the layout from the head's text, then reads its data rows again from the bytes. */
  private startBodyFromBytes(complete: boolean): void {
    const head = this.window.take(complete);
    this.setLayout(head);
    const all = concatBytes(this.headBytes);
    this.headBytes = [];
    const lineBreak = head.lineBreak === '\r' ? 13 : 10;
    let pos = 0;
    for (let n = 0; n < this.line; n++) {
      const at = all.indexOf(lineBreak, pos);
      if (at < 0) {
        pos = all.length;
        break;
      }
      pos = at + 1;
    }
    this.consumeBytes(all.subarray(pos), complete);
  }

  private consumeBytes(chunk: Uint8Array, final: boolean): void {
    let bytes = chunk;
    if (this.byteCarry.length) {
      // Finish the carried line on its own, so that the chunk itself is never copied.
      const lineBreak = this.lineBreak === '\r' ? 13 : 10;
      const nl = chunk.indexOf(lineBreak);
      if (nl < 0) bytes = concatBytes([this.byteCarry, chunk]);
      else {
        const joined = concatBytes([this.byteCarry, chunk.subarray(0, nl + 1)]);
        this.byteCarry = new Uint8Array(0);
        this.byteRows(joined);
        bytes = chunk.subarray(nl + 1);
      }
    }
    let start = this.byteRows(bytes);
    if (final && start < bytes.length) {
      this.line++;
      const text = this.byteText.decode(bytes.subarray(start));
      this.row(text, 0, text.length);
      start = bytes.length;
    }
    // A copy: the tail of a 4 MB chunk must not keep the whole chunk alive.
    this.byteCarry = bytes.slice(start);
    if (this.byteCarry.length > this.limits.maxLineChars + 1) throw dataLineTooLong(this.line + 1, null, this.limits.maxLineChars);
  }

  /**
   * The hot loop of byte mode: every complete line in `bytes`, numbers parsed in place by
   * readByteNumber (correctly rounded). A line it is unsure of (quotes, markers, text, a blank cell, a
   * wrong count, a line or cell over its limit) is decoded and read by `row`, which names the line in
   * its error. Returns where the unfinished last line starts.
   */
  private byteRows(bytes: Uint8Array): number {
    const layout = this.layout as CaptureLayout;
    const lineBreak = this.lineBreak === '\r' ? 13 : 10;
    const ws = layout.delimiter === 'whitespace';
    const d = ws ? 32 : layout.delimiter.charCodeAt(0);
    const k = layout.fieldCount;
    const trailing = layout.trailingDelimiter;
    const timeCol = layout.timeColumn ?? -1;
    const cols = this.columns;
    const values = this.rowValues.length === k ? this.rowValues : (this.rowValues = new Float64Array(k));
    const maxLine = this.limits.maxLineChars;
    const decimal = this.decimalCode;
    const num = this.number;
    let pos = 0;
    for (;;) {
      const nl = bytes.indexOf(lineBreak, pos);
      if (nl < 0) return pos;
      const lineEnd = lineBreak === 10 && nl > pos && bytes[nl - 1] === 13 ? nl - 1 : nl;
      let ok = lineEnd > pos && lineEnd - pos <= maxLine;
      let p = pos;
      for (let c = 0; ok && c < k; c++) {
        while (p < lineEnd && (bytes[p] === 32 || bytes[p] === 9)) p++;
        // The common shape, inline: [-]digits[.digits] with at most 15 digits, exactly s / 10^k (the
        // exact fast path of readByteNumber); anything else goes to readByteNumber itself. Inlining
        // took the 27 MB file from 100–120 to 165–205 MB/s of CPU time on this (loaded) machine.
        let i = p;
        let b = bytes[i];
        const negative = b === 45;
        if (negative) b = bytes[++i];
        let significand = 0;
        let fraction = 0;
        let digits = 0;
        while (b >= 48 && b <= 57 && digits < 15) {
          significand = significand * 10 + (b - 48);
          digits++;
          b = bytes[++i];
        }
        if (b === decimal) {
          b = bytes[++i];
          while (b >= 48 && b <= 57 && digits < 15) {
            significand = significand * 10 + (b - 48);
            fraction++;
            digits++;
            b = bytes[++i];
          }
        }
        let v: number;
        if (digits > 0 && !(b >= 48 && b <= 57) && b !== 101 && b !== 69 && b !== decimal) {
          const magnitude = fraction === 0 ? significand : significand / POW10[fraction];
          v = negative ? -magnitude : magnitude;
          num.end = i;
        } else if (readByteNumber(bytes, p, lineEnd, decimal, num)) v = num.value;
        else {
          ok = false;
          break;
        }
        if (v - v !== 0 || (c === timeCol && cols[c].length > 0 && v < cols[c].last())) ok = false;
        values[c] = v;
        let q = num.end;
        while (q < lineEnd && (bytes[q] === 32 || bytes[q] === 9)) q++;
        if (c < k - 1) {
          if (ws) ok = q > num.end;
          else if (bytes[q] === d) q++;
          else ok = false;
        } else {
          if (trailing && !ws && bytes[q] === d) q++;
          while (q < lineEnd && (bytes[q] === 32 || bytes[q] === 9)) q++;
          ok = ok && q === lineEnd;
        }
        p = q;
      }
      this.line++;
      if (ok) {
        if (this.rowCount >= this.maxRows) throw tooManySamples(this.line, this.limits.maxSamples);
        for (let c = 0; c < k; c++) cols[c].push(values[c]);
        this.rowLines.push(this.line);
        this.rowCount++;
      } else {
        const text = this.byteText.decode(bytes.subarray(pos, lineEnd));
        this.row(text, 0, text.length);
      }
      pos = nl + 1;
    }
  }

  private startBody(complete: boolean): void {
    const head = this.window.take(complete);
    const lines = this.setLayout(head);
    // Re-read the data rows of the head with the same code as the rest of the body.
    const body = lines.slice(this.line).join('\n') + (lines.length > this.line ? '\n' : '');
    const savedBreak = this.lineBreak;
    this.lineBreak = '\n';
    this.consume(body, false);
    this.lineBreak = savedBreak;
    this.consume(head.rest, complete);
  }

  /** Sniffs the layout from the head and sizes the columns; leaves `line` at the last line before the data. Returns the head's lines. */
  private setLayout(head: Head): string[] {
    const lines = head.lines;
    this.lineBreak = head.lineBreak;
    this.lineEnding = head.lineEnding;
    // The layout comes from the first lines only; everything after them is body.
    this.layout = sniffLayout(lines.slice(0, HEAD_LINES), 1, { limits: this.limits, cutBeforeLine: head.cutBeforeLine });
    this.decimalCode = this.layout.decimal.charCodeAt(0);
    const channels = this.layout.fieldCount - (this.layout.timeColumn !== null ? 1 : 0) - (this.layout.indexColumn !== null ? 1 : 0);
    this.maxRows = Math.floor(this.limits.maxSamples / Math.max(1, channels));
    const estimate = this.options.expectedChars ? Math.ceil((this.options.expectedChars / Math.max(head.chars, 1)) * lines.length * 1.05) + 16 : 1024;
    const capacity = Math.min(estimate, this.maxRows);
    this.columns = Array.from({ length: this.layout.fieldCount }, () => new GrowableColumn(capacity, this.maxRows));
    this.rowLines = new GrowableColumn(capacity, this.maxRows, lineNumbers);
    this.invalid = new Array(this.layout.fieldCount).fill(0);
    this.firstInvalid = new Array(this.layout.fieldCount).fill(null);
    this.line = this.layout.dataStartLine - 1;
    return lines;
  }

  private consume(chunk: string, final: boolean): void {
    const text = this.carry + chunk;
    const br = this.lineBreak;
    let start = br === '\n' ? this.plainRows(text) : 0;
    for (;;) {
      let end = text.indexOf(br, start);
      if (end < 0) {
        if (!final) break;
        end = text.length;
        if (start >= end) break;
      }
      this.line++;
      let lineEnd = end;
      if (lineEnd > start && text.charCodeAt(lineEnd - 1) === 13) lineEnd--;
      this.row(text, start, lineEnd);
      start = end + br.length;
      if (start > text.length) break;
    }
    this.carry = final ? '' : text.slice(start);
    // A line that does not end is refused before it is held whole; one more character is a CR of CRLF.
    if (this.carry.length > this.limits.maxLineChars + 1) throw dataLineTooLong(this.line + 1, null, this.limits.maxLineChars);
  }

  /**
   * The hot loop for the common layout (a single-character delimiter, a decimal point, LF or CRLF):
   * complete lines of plain numbers are read here with one indexOf and one Number() per cell and no
   * other allocation. Any line it is unsure of (quotes, markers, wrong count, a blank cell) goes to
   * `row`, which reads it carefully and names the line in its error; so does a line or cell over its
   * limit. Returns where it stopped.
   */
  private plainRows(text: string): number {
    const layout = this.layout as CaptureLayout;
    if (layout.delimiter === 'whitespace' || layout.decimal !== '.') return 0;
    const d = layout.delimiter;
    const k = layout.fieldCount;
    const trailing = layout.trailingDelimiter;
    const timeCol = layout.timeColumn ?? -1;
    const cols = this.columns;
    const values = this.rowValues.length === k ? this.rowValues : (this.rowValues = new Float64Array(k));
    const maxLine = this.limits.maxLineChars;
    const maxCell = this.limits.maxCellChars;
    const maxRows = this.maxRows;
    // The first delimiter after an unfinished search: lines that end before it have none, and are not
    // searched again (else each blank line of a chunk would scan to the next delimiter, quadratic).
    let nextDelimiter = -1;
    let pos = 0;
    for (;;) {
      const nl = text.indexOf('\n', pos);
      if (nl < 0) return pos;
      const lineEnd = nl > pos && text.charCodeAt(nl - 1) === 13 ? nl - 1 : nl;
      let e = lineEnd;
      if (trailing && e > pos && text.charCodeAt(e - 1) === d.charCodeAt(0)) e--;
      let p = pos;
      let ok = e > pos && lineEnd - pos <= maxLine && nextDelimiter <= e;
      for (let c = 0; ok && c < k; c++) {
        let ce = c === k - 1 ? e : text.indexOf(d, p);
        if (ce < 0 || ce > e) {
          nextDelimiter = ce < 0 ? text.length : ce;
          ce = -1;
        }
        if (ce <= p || ce - p > maxCell) {
          ok = false;
          break;
        }
        const v = +text.slice(p, ce);
        if (v - v !== 0 || (c === timeCol && cols[c].length > 0 && v < cols[c].last())) ok = false;
        values[c] = v;
        p = ce + 1;
      }
      this.line++;
      if (ok) {
        if (this.rowCount >= maxRows) throw tooManySamples(this.line, this.limits.maxSamples);
        for (let c = 0; c < k; c++) cols[c].push(values[c]);
        this.rowLines.push(this.line);
        this.rowCount++;
      } else {
        this.row(text, pos, lineEnd);
      }
      pos = nl + 1;
    }
  }

  /** One body line, text[start, end). Blank lines are skipped; anything else must be a full row of numbers. */
  private row(text: string, start: number, end: number): void {
    const layout = this.layout as CaptureLayout;
    if (end - start > this.limits.maxLineChars) throw dataLineTooLong(this.line, end - start, this.limits.maxLineChars);
    let blank = true;
    for (let i = start; i < end; i++) {
      const c = text.charCodeAt(i);
      if (c !== 32 && c !== 9) {
        blank = false;
        break;
      }
    }
    if (blank) return;
    if (this.rowCount >= this.maxRows) throw tooManySamples(this.line, this.limits.maxSamples);
    const k = layout.fieldCount;
    const ws = layout.delimiter === 'whitespace';
    const d = ws ? ' ' : layout.delimiter;
    let pos = start;
    if (ws) while (pos < end && (text.charCodeAt(pos) === 32 || text.charCodeAt(pos) === 9)) pos++;
    for (let c = 0; c < k; c++) {
      if (pos > end || (ws && pos === end)) throw this.countError(c, k);
      let cellEnd: number;
      if (ws) {
        cellEnd = pos;
        while (cellEnd < end && text.charCodeAt(cellEnd) !== 32 && text.charCodeAt(cellEnd) !== 9) cellEnd++;
      } else {
        cellEnd = text.indexOf(d, pos);
        if (cellEnd < 0 || cellEnd > end) cellEnd = end;
      }
      this.cell(text, pos, cellEnd, c);
      pos = cellEnd + 1;
      if (ws) while (pos < end && (text.charCodeAt(pos) === 32 || text.charCodeAt(pos) === 9)) pos++;
    }
    if (pos <= end) {
      const rest = text.slice(pos - (ws ? 0 : 1), end);
      const extra = ws ? rest.trim() !== '' : !(layout.trailingDelimiter && rest === d) && rest !== '';
      if (extra) throw this.countError(k + rest.split(d).filter((x) => x.trim() !== '').length, k);
    }
    this.rowLines.push(this.line);
    this.rowCount++;
  }

  private cell(text: string, from: number, to: number, c: number): void {
    const layout = this.layout as CaptureLayout;
    if (to - from > this.limits.maxCellChars) throw cellTooLong(this.line, c + 1, to - from, this.limits.maxCellChars);
    const raw = text.slice(from, to);
    let v = this.decimalCode === 44 ? +raw.replace(',', '.') : +raw;
    // Number() accepts "", " " (as 0), "0x1F" and "Infinity": those, and anything not a number, go
    // through the careful parser, which knows the invalid-sample markers and the decimal mark.
    if (v - v !== 0 || (v === 0 && raw.trim() === '') || (this.decimalCode === 44 && raw.includes('.')) || raw.charCodeAt(1) === 120) {
      const parsed = cellValue(raw, layout.decimal);
      if (parsed === undefined) {
        throw new CsvError(`"${excerpt(raw.trim())}" in column ${c + 1} (${excerpt(layout.columns[c].name)}) is not a number.`, this.line);
      }
      v = parsed;
    }
    if (Number.isNaN(v)) {
      if (c === layout.timeColumn) throw new CsvError(`The time column has no value here (expected a number).`, this.line);
      this.invalid[c]++;
      if (this.firstInvalid[c] === null) this.firstInvalid[c] = this.line;
    } else if (c === layout.timeColumn && this.columns[c].length > 0 && v < this.columns[c].last()) {
      throw new CsvError(`Time goes backwards here (${v} after ${this.columns[c].last()}).`, this.line);
    }
    this.columns[c].push(v);
  }

  private countError(found: number, expected: number): CsvError {
    // Each title shortened, and the list too: 66 titles of 1,024 characters would not fit a message.
    const names = (this.layout as CaptureLayout).columns.map((c) => excerpt(c.name)).join(', ');
    return new CsvError(`Expected ${expected} values (${excerpt(names, 200)}) but found ${found}.`, this.line);
  }

  private result(sampleRateHint: number | null | undefined): CaptureData {
    const layout = this.layout as CaptureLayout;
    const rows = this.rowCount;
    const lines = this.rowLines.values();
    if (rows < 2) throw new CsvError(`A capture needs at least 2 rows of data; this file has ${rows}.`, lines[0] ?? layout.dataStartLine);
    const channelIdx = layout.columns.map((_, i) => i).filter((i) => i !== layout.timeColumn && i !== layout.indexColumn);
    if (channelIdx.length === 0) throw new CsvError('The file has a time column but no channel of measured values.', layout.headerLine ?? layout.dataStartLine);

    let interval: number;
    let t0 = 0;
    let timeSource: CaptureData['timeSource'];
    let timeDeviation = 0;
    if (layout.timeColumn !== null) {
      const tb = timeBaseFromColumn(this.columns[layout.timeColumn].values(), layout.timeScale, (r) => lines[r]);
      interval = tb.interval;
      t0 = tb.t0;
      timeDeviation = tb.maxDeviation;
      timeSource = 'column';
    } else if (layout.interval) {
      interval = layout.interval.seconds;
      timeSource = 'preamble';
    } else if (sampleRateHint && sampleRateHint > 0) {
      interval = 1 / sampleRateHint;
      timeSource = 'given';
    } else {
      throw new CsvError('The file has neither a time column nor a sample interval in its header lines: give the sample rate.', undefined, 'needs_sample_rate');
    }
    return {
      layout,
      lineEnding: this.lineEnding,
      rows,
      sampleRate: 1 / interval,
      t0,
      timeSource,
      timeDeviation,
      channels: channelIdx.map((i) => ({
        name: layout.columns[i].name,
        unit: layout.columns[i].unit,
        samples: this.columns[i].values(),
        invalidCount: this.invalid[i],
        firstInvalidLine: this.firstInvalid[i],
      })),
    };
  }
}

function concatBytes(parts: Uint8Array[]): Uint8Array {
  if (parts.length === 1) return parts[0];
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}
