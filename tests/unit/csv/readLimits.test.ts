/**
 * The reader's limits: each refusal has code `too_large`, names the limit and the line, and comes before
 * the memory is taken. The defaults are Crestline's own choice (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { CsvError, MAX_MESSAGE_CHARS } from '../../../shared/csv';
import { readCaptureBytes, type ReadCaptureOptions } from '../../../shared/csv/readCaptureBytes';
import { DEFAULT_READ_LIMITS, resolveReadLimits } from '../../../shared/csv/readLimits';

const encoder = new TextEncoder();

function refusal(text: string | Iterable<Uint8Array>, options: ReadCaptureOptions = {}): CsvError {
  try {
    readCaptureBytes(typeof text === 'string' ? [encoder.encode(text)] : text, options);
  } catch (e) {
    if (e instanceof CsvError) return e;
    throw e;
  }
  throw new Error('the file was read');
}

/** The text in chunks of 64 KiB, counting how many the reader asked for before it stopped. */
function chunked(text: string): { chunks: Iterable<Uint8Array>; pulled: () => number } {
  const bytes = encoder.encode(text);
  let pulled = 0;
  function* chunks() {
    for (let i = 0; i < bytes.length; i += 65536) {
      pulled++;
      yield bytes.subarray(i, i + 65536);
    }
  }
  return { chunks: chunks(), pulled: () => pulled };
}

const rows = (n: number, channels: number, d = ',') => Array.from({ length: n }, (_, r) => [r, ...Array.from({ length: channels }, (_, c) => r + c)].join(d)).join('\n') + '\n';
const titles = (channels: number, d = ',') => ['Time (s)', ...Array.from({ length: channels }, (_, c) => `CH${c + 1} (V)`)].join(d) + '\n';

describe('resolveReadLimits', () => {
  it('gives the defaults where nothing is given', () => {
    expect(resolveReadLimits()).toEqual({ maxChannels: 64, maxNameChars: 1024, maxHeadBytes: 1048576, maxLineChars: 65536, maxCellChars: 100, maxSamples: 200_000_000 });
    expect(resolveReadLimits({ maxSamples: 1000.7 })).toEqual({ ...DEFAULT_READ_LIMITS, maxSamples: 1000 });
  });

  it.each([0, -1, 0.5, NaN])('refuses %f as a limit', (v) => {
    expect(() => resolveReadLimits({ maxChannels: v })).toThrow(RangeError);
  });
});

describe('the head limit (maxHeadBytes)', () => {
  it('a 5 MB first line is refused after its first MiB, whole or streamed', () => {
    const text = 'a,'.repeat(2_500_000);
    const start = performance.now();
    const e = refusal(text);
    expect(performance.now() - start).toBeLessThan(1000);
    expect(e).toMatchObject({ code: 'too_large', line: 1, message: 'Line 1 is longer than 1,048,576 characters; the header lines may hold at most 1 MiB.' });
    const stream = chunked(text);
    expect(refusal(stream.chunks).message).toBe(e.message);
    expect(stream.pulled()).toBe(17);
  });

  it('header lines that fill the first MiB without a row of data are refused, naming the line cut', () => {
    // 262 lines of 4,001 characters fit in 1,048,576; line 263 ends beyond.
    const text = `# ${'a'.repeat(3998)}\n`.repeat(300) + titles(1) + rows(3, 1);
    expect(refusal(text)).toMatchObject({ code: 'too_large', line: 263, message: 'No row of data within the first 1 MiB of the file (line 263 ends beyond it); the header lines may hold at most 1 MiB.' });
  });

  it('limits the head only: a body longer than the limit reads', () => {
    const r = readCaptureBytes([encoder.encode(titles(1) + rows(1000, 1))], { limits: { maxHeadBytes: 64 } });
    expect(r.rows).toBe(1000);
  });
});

describe('the channel limit (maxChannels)', () => {
  it('1,000 columns are refused on the header line', () => {
    expect(refusal(titles(999) + rows(3, 999))).toMatchObject({ code: 'too_large', line: 1, message: 'The file has 1,000 columns; Crestline reads at most 64 channels per capture.' });
  });

  it('64 channels read beside a time and a sample-number column; 65 do not', () => {
    const indexed = `Index,${titles(64)}` + rows(3, 65);
    expect(readCaptureBytes([encoder.encode(indexed)]).channels.length).toBe(64);
    expect(refusal(titles(65) + rows(3, 65))).toMatchObject({ code: 'too_large', line: 1, message: 'The file has 66 columns, 65 of them channels; Crestline reads at most 64 channels per capture.' });
  });

  it('without a header, the first row of data is named', () => {
    expect(refusal(`# logger\n${rows(3, 80)}`)).toMatchObject({ code: 'too_large', line: 2 });
  });
});

describe('the name limit (maxNameChars)', () => {
  const long = 'N'.repeat(70_000);

  it('a column title of 70,004 characters is refused on its line', () => {
    expect(refusal(`# export\n${titles(1).replace('CH1', long)}${rows(3, 1)}`)).toMatchObject({
      code: 'too_large',
      line: 2,
      message: 'Column title on line 2 is 70,004 characters long; at most 1,024 are allowed.',
    });
  });

  it.each([
    [`${'k'.repeat(2000)}: 5`, 'Header key on line 1 is 2,000 characters long; at most 1,024 are allowed.'],
    [`# Note: ${'v'.repeat(2000)}`, 'Header value on line 1 is 2,000 characters long; at most 1,024 are allowed.'],
  ])('a preamble entry over the limit is refused: %#', (line, message) => {
    expect(refusal(`${line}\n${titles(1)}${rows(3, 1)}`)).toMatchObject({ code: 'too_large', line: 1, message });
  });

  it('a 70,000-character name quoted in another error is shortened: the message stays under 500 characters', () => {
    const text = titles(1).replace('CH1', long) + rows(3, 1) + '3,4,5\n';
    const count = refusal(text, { limits: { maxNameChars: Infinity } });
    expect(count).toMatchObject({ code: 'invalid_csv', line: 5, message: `Expected 2 values (Time, ${'N'.repeat(40)}…) but found 3.` });
    const notANumber = refusal(titles(1).replace('CH1', long) + rows(3, 1) + '3,abc\n', { limits: { maxNameChars: Infinity } });
    expect(notANumber.message).toBe(`"abc" in column 2 (${'N'.repeat(40)}…) is not a number.`);
  });

  it('66 titles of 1,024 characters in a count error still make a short message', () => {
    const names = ['Time (s)', ...Array.from({ length: 64 }, (_, c) => `${String(c).padEnd(1020, 'x')} (V)`)].join(',') + '\n';
    const e = refusal(names + rows(3, 64) + '3\n');
    expect(e.line).toBe(5);
    expect(e.message.length).toBeLessThanOrEqual(MAX_MESSAGE_CHARS);
    expect(e.message).toMatch(/^Expected 65 values \(Time, 0x{39}…, 1x{39}…, .*…\) but found 1\.$/);
  });
});

describe('the line and cell limits (maxLineChars, maxCellChars)', () => {
  it.each([
    ['comma, a cell of leading zeros (fast path)', ',', `${'0'.repeat(1999)}1`],
    ['comma, a cell of 2,000 digits (careful path)', ',', '1'.repeat(2000)],
    ['whitespace-separated', ' ', `${'0'.repeat(1999)}1`],
  ])('a 2,000-character cell is refused on its line: %s', (_, d, cell) => {
    expect(refusal(titles(2, d) + rows(2, 2, d) + `2${d}${cell}${d}4\n` + rows(2, 2, d))).toMatchObject({
      code: 'too_large',
      line: 4,
      message: 'Column 2 on line 4 holds 2,000 characters; a cell of data may hold at most 100.',
    });
  });

  it('a 70,003-character line of data is refused on its line', () => {
    expect(refusal(titles(1) + rows(2, 1) + `2,3${' '.repeat(70_000)}\n`)).toMatchObject({
      code: 'too_large',
      line: 4,
      message: 'Line 4 has 70,003 characters; a row of data may hold at most 65,536.',
    });
  });

  it('a line of data that does not end is refused before it is held whole', () => {
    const stream = chunked(titles(2) + rows(2, 2) + '1'.repeat(5_000_000));
    expect(refusal(stream.chunks)).toMatchObject({ code: 'too_large', line: 4, message: 'Line 4 has more than 65,536 characters; a row of data may hold at most 65,536.' });
    // With only 3 lines before it, the line fills the 1 MiB head window first: 16 chunks, and the 17th.
    expect(stream.pulled()).toBe(17);
    // After 400 lines the body has started (in the first chunk), and the line is refused in the second.
    const late = chunked(titles(2) + rows(2000, 2) + '1'.repeat(5_000_000));
    expect(refusal(late.chunks)).toMatchObject({ code: 'too_large', line: 2002 });
    expect(late.pulled()).toBe(2);
  });
});

describe('the sample budget (maxSamples, rows × channels)', () => {
  // 1,000 samples over 2 channels are 500 rows, on lines 2 to 501; the row on line 502 is one too many.
  it.each([
    ['comma-separated (fast path)', ','],
    ['whitespace-separated (careful path)', ' '],
  ])('is refused on the first row beyond it: %s', (_, d) => {
    const text = titles(2, d) + rows(600, 2, d);
    const message = 'The file holds more than 1,000 samples (rows × channels), the most this server reads at once; split the capture.';
    expect(refusal(text, { limits: { maxSamples: 1000 } })).toMatchObject({ code: 'too_large', line: 502, message });
    expect(refusal(chunked(text).chunks, { limits: { maxSamples: 1000 } })).toMatchObject({ line: 502 });
    expect(readCaptureBytes([encoder.encode(titles(2, d) + rows(500, 2, d))], { limits: { maxSamples: 1000 } }).rows).toBe(500);
  });

  it('columns are never allocated beyond it, whatever the size announced', () => {
    for (const totalBytes of [undefined, 1e9]) {
      const r = readCaptureBytes([encoder.encode(titles(2) + rows(500, 2))], { totalBytes, limits: { maxSamples: 1000 } });
      expect(r.channels[0].samples.buffer.byteLength).toBeLessThanOrEqual(500 * 8);
    }
  });
});
