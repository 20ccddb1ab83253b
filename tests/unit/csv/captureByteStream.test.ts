import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CaptureByteStream, readCaptureBytes } from '../../../shared/csv/readCaptureBytes';

/**
 * An upload is read as it arrives, in whatever pieces the network delivers. Reading it that way must
 * give exactly what reading the stored file gives: the same layout, encoding, time base and samples,
 * or the same error on the same line. (Common practice, no source: a streaming parser must not
 * depend on where its input is split.)
 */
const fixtures = (dir: string) => readdirSync(path.join('fixtures', dir)).filter((f) => f.endsWith('.csv')).map((f) => path.join('fixtures', dir, f));
const files = [...fixtures('dialects'), ...fixtures('waveforms'), ...fixtures('bad')];

function readWhole(bytes: Uint8Array, sampleRateHint: number | null) {
  try {
    return { ok: readCaptureBytes([bytes], { sampleRateHint }) };
  } catch (err) {
    return { error: err };
  }
}

function readInPieces(bytes: Uint8Array, cuts: number[], sampleRateHint: number | null, hintAtEnd: boolean) {
  try {
    const stream = new CaptureByteStream({ sampleRateHint: hintAtEnd ? null : sampleRateHint });
    let at = 0;
    for (const cut of [...cuts, bytes.length]) {
      stream.push(bytes.subarray(at, cut));
      at = cut;
    }
    return { ok: hintAtEnd ? stream.finish(sampleRateHint) : stream.finish() };
  } catch (err) {
    return { error: err };
  }
}

describe('reading an upload as it arrives', () => {
  it.each(files)('%s: any split into pieces reads as the whole file does', (file) => {
    const bytes = new Uint8Array(readFileSync(file));
    const whole = readWhole(bytes, 1000);
    const cutsOf = fc.uniqueArray(fc.integer({ min: 0, max: bytes.length }), { maxLength: 40 }).map((c) => c.sort((a, b) => a - b));
    fc.assert(
      fc.property(cutsOf, fc.boolean(), (cuts, hintAtEnd) => {
        expect(readInPieces(bytes, cuts, 1000, hintAtEnd)).toEqual(whole);
      }),
      { numRuns: 25 },
    );
  });

  it('tells the encoding from the first 64 KiB however small the first pieces are', () => {
    // A UTF-16 byte-order mark split over one-byte pieces is still a byte-order mark.
    const text = `Time (s),CH1 (V)\n${Array.from({ length: 3000 }, (_, i) => `${i / 1000},${Math.sin(i / 10).toFixed(6)}`).join('\n')}\n`;
    const utf16 = new Uint8Array(2 + text.length * 2);
    utf16.set([0xff, 0xfe]);
    for (let i = 0; i < text.length; i++) utf16[2 + 2 * i] = text.charCodeAt(i);
    const cuts = Array.from({ length: 200 }, (_, i) => i + 1);
    const pieces = readInPieces(utf16, cuts, null, false);
    expect(pieces).toEqual(readWhole(utf16, null));
    expect(pieces.ok?.encoding).toBe('utf-16le');
  });

  it('takes the sample rate at the end, for a file without a time base (a form field sent after the file)', () => {
    const bytes = readFileSync('fixtures/bad/needs-sample-rate.csv');
    const early = new CaptureByteStream();
    early.push(bytes);
    const data = early.finish(2000);
    expect(data.sampleRate).toBe(2000);
    expect(data.timeSource).toBe('given');
  });
});
