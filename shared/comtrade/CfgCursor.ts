import { ComtradeError } from './ComtradeError';
import type { ComtradeLimits } from './comtradeLimits';
import { decimalText } from './cfgValues';

export interface CfgLine {
  fields: string[];
  line: number;
}

/**
 * Walks the lines of a .cfg (or of the CFG section of a .cff), one record line at a time, and reads its
 * fields with errors that name the file and line. Blank lines are passed over.
 */
export class CfgCursor {
  private readonly lines: string[];
  private next = 0;

  constructor(
    text: string,
    private readonly firstLine: number,
    readonly file: string,
    private readonly limits: ComtradeLimits,
  ) {
    this.lines = text.split('\n');
    const long = this.lines.findIndex((l) => l.length > limits.maxLineChars);
    if (long >= 0) throw this.error(firstLine + long, `the line is longer than ${limits.maxLineChars.toLocaleString('en-US')} characters.`);
  }

  error(line: number, reason: string): ComtradeError {
    return new ComtradeError({ file: this.file, line }, reason);
  }

  /** The next non-blank line, or null at the end. */
  take(): CfgLine | null {
    while (this.next < this.lines.length) {
      const i = this.next++;
      const text = this.lines[i].endsWith('\r') ? this.lines[i].slice(0, -1) : this.lines[i];
      if (text.trim() !== '') return { fields: text.split(','), line: this.firstLine + i };
    }
    return null;
  }

  /** The next line, which must be there and have `count` fields (or from `count` to `most`). */
  expect(what: string, count: number, most = count, hint = ''): CfgLine {
    const l = this.take();
    if (!l) throw this.error(this.firstLine + this.lines.length - 1, `the configuration ends before ${what}.`);
    if (l.fields.length < count || l.fields.length > most) {
      const wanted = count === most ? `${count}` : `${count} to ${most}`;
      throw this.error(l.line, `expected ${what} (${wanted} comma-separated fields) but found ${l.fields.length} fields.${hint ? ` ${hint}` : ''}`);
    }
    return l;
  }

  /** A name field, trimmed and cut to the name bound. */
  text(l: CfgLine, i: number): string {
    return (l.fields[i] ?? '').trim().slice(0, this.limits.maxNameChars);
  }

  /** A number field; `fallback` when it is empty (else an empty field is an error). */
  number(l: CfgLine, i: number, what: string, fallback?: number): number {
    const raw = (l.fields[i] ?? '').trim();
    if (raw === '' && fallback !== undefined) return fallback;
    const v = decimalText(raw);
    if (Number.isNaN(v)) throw this.error(l.line, `${what} (field ${i + 1}) is not a number: "${raw.slice(0, 40)}".`);
    return v;
  }

  /** A whole number field from `min` to `max`. */
  integer(l: CfgLine, i: number, what: string, min: number, max: number): number {
    const v = this.number(l, i, what);
    if (!Number.isInteger(v) || v < min || v > max) throw this.error(l.line, `${what} (field ${i + 1}) must be a whole number from ${min} to ${max.toLocaleString('en-US')}; it is ${l.fields[i].trim().slice(0, 40)}.`);
    return v;
  }
}
