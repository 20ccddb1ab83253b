import { CsvError } from './CsvError';
import { headLineTooLong } from './limitErrors';

/** The first lines of a file, ready for sniffing, and the text after them. */
export interface Head {
  /** Complete lines without their line breaks; the last line of a complete file needs no break. */
  lines: string[];
  lineBreak: '\n' | '\r';
  lineEnding: 'LF' | 'CRLF' | 'CR';
  /** Where `lines` end in the text taken, in characters: what the lines covered, breaks included. */
  chars: number;
  /** The text after `lines`: the rest of the chunks pushed. */
  rest: string;
  /** The file line cut off by the character limit, when the window ended there with more text to come. */
  cutBeforeLine: number | null;
}

/**
 * Collects the head of a file from chunks of any size: up to `maxLines` line breaks or `maxChars`
 * characters, whichever comes first. Only the new chunk is scanned on each push, and only up to the
 * limit, so a 5 MB line costs no more than `maxChars` to refuse.
 */
export class HeadWindow {
  private parts: string[] = [];
  private chars = 0;
  private breaks = 0;

  constructor(
    private readonly maxChars: number,
    private readonly maxLines: number,
  ) {}

  /** Adds a chunk; true once the window is full and `take` should be called. */
  add(text: string): boolean {
    const room = Math.min(text.length, this.maxChars + 1 - this.chars);
    for (let i = 0; i < room && this.breaks <= this.maxLines; i++) {
      const c = text.charCodeAt(i);
      if (c === 10 || c === 13) this.breaks++;
    }
    this.parts.push(text);
    this.chars += text.length;
    return this.breaks > this.maxLines || this.chars > this.maxChars;
  }

  /**
   * The complete lines of the window. Throws an `empty` CsvError when the window holds only whitespace,
   * and the head-limit one when not even the first line ends within `maxChars`.
   *
   * @param complete no more text will come: the window's last line is complete without a break
   */
  take(complete: boolean): Head {
    const text = this.prefix(this.maxChars);
    if (text.trim() === '') throw new CsvError('The file is empty.', undefined, 'empty');
    const crlf = text.indexOf('\r\n');
    const lf = text.indexOf('\n');
    const cr = lf < 0 && text.includes('\r');
    const lineBreak = cr ? '\r' : '\n';
    const lineEnding = cr ? 'CR' : crlf >= 0 && crlf === lf - 1 ? 'CRLF' : 'LF';
    const whole = complete && this.chars <= this.maxChars;
    const cut = whole ? text.length : text.lastIndexOf(lineBreak) + 1;
    if (cut === 0 && !whole) throw headLineTooLong(1, this.maxChars);
    const lines = text
      .slice(0, cut)
      .split(lineBreak)
      .map((l) => (l.endsWith('\r') ? l.slice(0, -1) : l));
    if (!whole || lines[lines.length - 1] === '') lines.pop();
    const cutByChars = this.chars > this.maxChars && this.breaks <= this.maxLines;
    return { lines, lineBreak, lineEnding, chars: cut, rest: this.suffix(cut), cutBeforeLine: cutByChars ? lines.length + 1 : null };
  }

  /** The first `n` characters of what was added, copying no more than that. */
  private prefix(n: number): string {
    const taken: string[] = [];
    let length = 0;
    for (const p of this.parts) {
      if (length + p.length >= n) {
        taken.push(p.slice(0, n - length));
        break;
      }
      taken.push(p);
      length += p.length;
    }
    return taken.join('');
  }

  /** What was added after the first `n` characters. */
  private suffix(n: number): string {
    let skipped = 0;
    const rest: string[] = [];
    for (const p of this.parts) {
      if (skipped >= n) rest.push(p);
      else if (skipped + p.length > n) rest.push(p.slice(n - skipped));
      skipped += p.length;
    }
    this.parts = [];
    return rest.join('');
  }
}
