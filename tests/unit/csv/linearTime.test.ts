/**
 * Reading time grows linearly with the text. Head detection (sniffLayout, and the whole CaptureReader)
 * is driven with hostile heads of about 100 kB: brackets, quotes, spaces, very long cells, random bytes,
 * mixed delimiters; the body with a million blank lines.
 *
 * The bound: a head of n characters is read in at most 250 ms + 15 µs × n, so 1.75 s at 100 kB. It guards
 * the complexity, not the speed (speed targets live in the bench). Measured on this machine: at most
 * 70 ms for any of 400 generated 100 kB heads, against 131 s for the previous code on the reported 8 kB
 * title (its pattern was cubic in it). A super-linear step overshoots the bound by orders of magnitude, a
 * loaded machine by nowhere near that.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CsvError } from '../../../shared/csv';
import { readCaptureBytes } from '../../../shared/csv/readCaptureBytes';
import type { ReadLimits } from '../../../shared/csv/readLimits';
import { sniffLayout } from '../../../shared/csv/sniffLayout';

const HEAD = 100_000;
const boundMs = (chars: number) => 250 + 0.015 * chars;
const encoder = new TextEncoder();

/** Limits that let every long title, cell and column through, so that the scans themselves run on them. */
const OPEN: Partial<ReadLimits> = { maxNameChars: Infinity, maxChannels: Infinity, maxLineChars: Infinity, maxCellChars: Infinity };

/** Milliseconds a step takes, whether it returns or refuses with a CsvError (anything else is a bug). */
function msToRead(step: () => unknown): number {
  const start = performance.now();
  try {
    step();
  } catch (e) {
    if (!(e instanceof CsvError)) throw e;
  }
  return performance.now() - start;
}

/**
 * Every way the head is read, each within the bound for its length. sniffLayout gets at most the 400
 * lines the reader gives it; csv-parse costs some 25 µs per quoted line, which would dominate otherwise.
 */
function expectLinear(text: string): void {
  const lines = text.split(/\r?\n/).slice(0, 400);
  expect(msToRead(() => sniffLayout(lines, 1, { limits: OPEN })), 'sniffLayout').toBeLessThan(boundMs(lines.join('\n').length));
  expect(msToRead(() => readCaptureBytes([encoder.encode(text)])), 'reader, default limits').toBeLessThan(boundMs(text.length));
  expect(msToRead(() => readCaptureBytes([encoder.encode(text)], { limits: OPEN })), 'reader, open limits').toBeLessThan(boundMs(text.length));
}

const repeatTo = (motif: string, chars: number) => motif.repeat(Math.ceil(chars / motif.length)).slice(0, chars);

const piece = fc.constantFrom(
  ...['(', ')', '[', ']', '{', '}', ' ', '    ', '\t', '"', '""', '/', ' / ', ':', '=', ',', ';', '#', '%', '//'],
  ...['.', '-', '+', 'e', '1', '2.5', '1e', 'V', 'CH1', 'µ', 'x', '\u00a0', 'NaN', 'Sample rate', '\r'],
);
const motif = fc.array(piece, { minLength: 1, maxLength: 6 }).map((p) => p.join(''));
const delimiter = fc.constantFrom(',', ';', '\t', ' ');
const placement = fc.constantFrom('title', 'units row', 'preamble', 'line', 'lines', 'data cell', 'mixed delimiters');

/** A head with the long text in one place, followed by a few rows of data. */
function head(where: string, long: string, d: string): string {
  const data = `0${d}1\n1${d}2\n2${d}3\n`;
  switch (where) {
    case 'title':
      return `Time (s)${d}CH1 ${long}\n${data}`;
    case 'units row':
      return `Time${d}CH1\ns${d}${long}\n${data}`;
    case 'preamble':
      return `# Sample rate: ${long}\nTime (s)${d}CH1 (V)\n${data}`;
    case 'line':
      return `${long}\n${data}`;
    case 'lines':
      return `${long.replace(/(.{50})/g, '$1\n')}\n${data}`;
    case 'data cell':
      return `Time (s)${d}CH1 (V)\n0${d}${long}\n${data}`;
    default:
      return `${[',', ';', '\t', ' '].map((x) => `Time (s)${x}${long.slice(0, HEAD / 4)}`).join('\n')}\n${data}`;
  }
}

describe('head detection stays linear', () => {
  it.each([8_000, 100_000])('the reported title "CH1 (" + %i spaces + "x" is read in well under a second', (spaces) => {
    const text = `Time (s),CH1 (${' '.repeat(spaces)}x\n0,1\n1,2\n`;
    expect(msToRead(() => readCaptureBytes([encoder.encode(text)]))).toBeLessThan(1000);
    const open = readCaptureBytes([encoder.encode(text)], { limits: { maxNameChars: Infinity } });
    expect(open.channels[0].name).toBe(`CH1 (${' '.repeat(spaces)}x`);
    expect(msToRead(() => readCaptureBytes([encoder.encode(text)], { limits: { maxNameChars: Infinity } }))).toBeLessThan(1000);
  });

  // Runs that the previous patterns backtracked over. Measured with the previous code: the title with
  // 2,000 spaces took 2.8 s (cubic), the key with 20,000 spaces before its colon 0.24 s and the key of
  // 20,000 parentheses 0.4 s (quadratic: some 6 and 10 s at 100 kB).
  it.each([
    ['a title "(" and spaces', `Time (s),CH1 (${' '.repeat(HEAD)}x`],
    ['a title of slashes and spaces', `Time (s),${repeatTo('a / ', HEAD)}`],
    ['a preamble key of spaces before a colon', `a${' '.repeat(HEAD)}x: 1`],
    ['a preamble key of spaces, whitespace-separated', `Sample${' '.repeat(HEAD)}`],
    ['a preamble key of open parentheses', `# Sample rate ${'('.repeat(HEAD)}: 5`],
    ['a preamble word of digits', `# ${'1'.repeat(HEAD)}x`],
    ['a preamble value of spaces', `# fs: ${' '.repeat(HEAD)}x`],
    ['a comment of spaces', `${' '.repeat(HEAD)}x`],
  ])('%s', (_, first) => {
    expectLinear(`${first}\nTime (s),CH1 (V)\n0,1\n1,2\n2,3\n`);
    expectLinear(`${first.replaceAll(',', ' ')}\nTime CH1\n0 1\n1 2\n2 3\n`);
  });

  it('any motif repeated to 100 kB, in a title, a units row, the preamble, whole lines or a data cell', () => {
    fc.assert(
      fc.property(motif, placement, delimiter, (m, where, d) => expectLinear(head(where, repeatTo(m, HEAD), d))),
      { numRuns: 60 },
    );
  });

  it('100 kB of random bytes, or of random characters that matter to the reader', () => {
    const alphabet = ' \t\r\n,;:="()[]{}/#%.+-eE019Vµ\u00a0';
    fc.assert(
      fc.property(fc.integer(), fc.boolean(), (seed, bytes) => {
        let x = seed >>> 0 || 1;
        const next = () => ((x = (Math.imul(x, 1103515245) + 12345) >>> 0) >>> 8);
        if (bytes) {
          const b = Uint8Array.from({ length: HEAD }, () => next() & 255);
          expect(msToRead(() => readCaptureBytes([b]))).toBeLessThan(boundMs(HEAD));
        } else {
          expectLinear(Array.from({ length: HEAD }, () => alphabet[next() % alphabet.length]).join(''));
        }
      }),
      { numRuns: 20 },
    );
  });
});

describe('the body stays linear', () => {
  it('a million blank lines between rows are skipped in well under 2 s', () => {
    // Each blank line used to send the fast path searching for the next delimiter, which lay beyond all
    // of them: 640,000 such lines took 10 s, quadratic in their number.
    const text = `Time (s),CH1 (V)\n${Array.from({ length: 10 }, (_, i) => `${i},1\n`).join('')}${' \n'.repeat(1_000_000)}10,1\n`;
    let rows = 0;
    expect(msToRead(() => (rows = readCaptureBytes([encoder.encode(text)]).rows))).toBeLessThan(2000);
    expect(rows).toBe(11);
  });
});
