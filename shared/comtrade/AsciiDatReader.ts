import { asciiNumber, isBlank } from './asciiNumber';
import { ComtradeError } from './ComtradeError';
import type { RecordColumns } from './RecordColumns';

/** The 1999 text writes 99999 for a missing ASCII value (DOMAIN.md §8e, from memory); an empty field is taken the same way. */
const MISSING_ASCII = 99999;

/**
 * Reads an ASCII .dat pushed as byte chunks: one record a line, `n,timestamp,A1…Ak,D1…Dm` (1999 clause
 * 7.2, from memory), numbers read straight from the bytes. Lines longer than the line bound are
 * refused before they are gathered; blank lines are allowed only at the end.
 */
export class AsciiDatReader {
  private carry: Uint8Array | null = null;
  private line: number;
  private blankAt: number | null = null;
  private readonly fields: number;

  constructor(
    private readonly cols: RecordColumns,
    private readonly file: string,
    private readonly maxLineChars: number,
    /** File line of the data's first line (a .cff's data follows its text sections). */
    private readonly firstLine = 1,
  ) {
    this.line = firstLine - 1;
    this.fields = 2 + cols.samples.length + cols.cfg.digital.length;
  }

  private error(line: number, reason: string): ComtradeError {
    return new ComtradeError({ file: this.file, line }, reason);
  }

  push(chunk: Uint8Array): void {
    let start = 0;
    if (this.carry) {
      const nl = chunk.indexOf(10);
      const end = nl < 0 ? chunk.length : nl;
      if (this.carry.length + end > this.maxLineChars) throw this.error(this.line + 1, `the line is longer than ${this.maxLineChars.toLocaleString('en-US')} characters.`);
      const joined = new Uint8Array(this.carry.length + end);
      joined.set(this.carry);
      joined.set(chunk.subarray(0, end), this.carry.length);
      if (nl < 0) {
        this.carry = joined;
        return;
      }
      this.carry = null;
      this.record(joined, 0, joined.length);
      start = nl + 1;
    }
    for (;;) {
      const nl = chunk.indexOf(10, start);
      if (nl < 0) break;
      this.record(chunk, start, nl);
      start = nl + 1;
    }
    if (chunk.length - start > this.maxLineChars) throw this.error(this.line + 1, `the line is longer than ${this.maxLineChars.toLocaleString('en-US')} characters.`);
    if (start < chunk.length) this.carry = chunk.slice(start);
  }

  /** One line, b[s, e) without its line feed. */
  private record(b: Uint8Array, s: number, e: number): void {
    this.line++;
    if (e > s && b[e - 1] === 13) e--;
    if (isBlank(b, s, e)) {
      this.blankAt ??= this.line;
      return;
    }
    if (this.blankAt !== null) throw this.error(this.blankAt, 'a blank line inside the data: every record must follow the one before.');
    const c = this.cols;
    const row = c.records;
    if (row >= c.cfg.sampleCount) throw this.error(this.line, `more records than the .cfg declares (${c.cfg.sampleCount.toLocaleString('en-US')}, the last endsamp).`);
    const analog = c.samples.length;
    let p = s;
    for (let f = 0; f < this.fields; f++) {
      let q = b.indexOf(44, p);
      if (q < 0 || q > e) q = e;
      if (p > e) throw this.countError(f);
      if (f === 1 && c.timestamps) {
        const ts = asciiNumber(b, p, q);
        if (Number.isNaN(ts) && !isBlank(b, p, q)) throw this.valueError(b, s, e, `the time stamp (field 2) is not a number.`);
        if (Number.isNaN(ts)) c.missingTimestamp(row);
        c.timestamps[row] = ts;
      } else if (f >= 2 && f < 2 + analog) {
        const ch = f - 2;
        const raw = asciiNumber(b, p, q);
        if (Number.isNaN(raw) && !isBlank(b, p, q)) throw this.valueError(b, s, e, `analog value ${ch + 1} (field ${f + 1}) is not a number.`);
        if (Number.isNaN(raw) || raw === MISSING_ASCII) c.invalid(ch, row);
        else c.samples[ch][row] = raw * c.factor[ch] + c.offset[ch];
      } else if (f >= 2) {
        const v = asciiNumber(b, p, q);
        if (v !== 0 && v !== 1) throw this.valueError(b, s, e, `digital value ${f - 1 - analog} (field ${f + 1}) must be 0 or 1.`);
        c.digital.set(f - 2 - analog, row, v as 0 | 1);
      }
      p = q + 1;
    }
    if (p <= e) throw this.countError(this.fields + 1 + countCommas(b, p, e));
    c.records++;
  }

  /** A bad value; but when the line has the wrong number of fields, that is the clearer reason. */
  private valueError(b: Uint8Array, s: number, e: number, reason: string): ComtradeError {
    const found = countCommas(b, s, e) + 1;
    return found === this.fields ? this.error(this.line, reason) : this.countError(found);
  }

  private countError(found: number): ComtradeError {
    const { cfg } = this.cols;
    return this.error(this.line, `expected ${this.fields} values (sample number, time stamp, ${cfg.analog.length} analog, ${cfg.digital.length} digital, as the .cfg declares on line ${cfg.lines.counts}) but found ${found}.`);
  }

  finish(): void {
    if (this.carry) {
      const rest = this.carry;
      this.carry = null;
      this.record(rest, 0, rest.length);
    }
    const c = this.cols;
    if (c.records < c.cfg.sampleCount) {
      throw this.error(this.line, `the data ends after ${c.records.toLocaleString('en-US')} records; the .cfg declares ${c.cfg.sampleCount.toLocaleString('en-US')} (the last endsamp).`);
    }
  }

  /** The file line of a record, for errors found after reading (its time stamp). */
  lineOf(row: number): number {
    return this.firstLine + row;
  }
}

function countCommas(b: Uint8Array, s: number, e: number): number {
  let n = 0;
  for (let i = s; i < e; i++) if (b[i] === 44) n++;
  return n;
}
