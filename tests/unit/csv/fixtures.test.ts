/** The reader against every fixture in fixtures/manifest.json; each expected value follows from the fixture's own text. */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { CsvError } from '../../../shared/csv';
import { readCaptureBytes } from '../../../shared/csv/readCaptureBytes';

const dir = path.resolve('fixtures');
const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8'));
const bytes = (file: string) => new Uint8Array(readFileSync(path.join(dir, file)));

describe('reading instrument dialects', () => {
  for (const f of manifest.dialects) {
    it(f.file, () => {
      const r = readCaptureBytes([bytes(f.file)]);
      expect(r.layout.delimiter).toBe(f.delimiter);
      expect(r.layout.decimal).toBe(f.decimal);
      if (f.encoding) expect(r.encoding).toBe(f.encoding);
      if (f.bom !== undefined) expect(r.bom).toBe(f.bom);
      if (f.lineEnding) expect(r.lineEnding).toBe(f.lineEnding);
      expect(r.rows).toBe(f.rows);
      expect(r.sampleRate).toBeCloseTo(f.sampleRate, 6);
      expect(r.t0).toBeCloseTo(f.t0, 12);
      expect(r.timeSource).toBe(f.timeSource);
      expect(r.channels.map((c) => ({ name: c.name, unit: c.unit }))).toEqual(f.channels.map((c: { name: string; unit: string }) => ({ name: c.name, unit: c.unit })));
      f.channels.forEach((c: { invalid?: number; firstInvalidLine?: number }, i: number) => {
        expect(r.channels[i].invalidCount).toBe(c.invalid ?? 0);
        if (c.firstInvalidLine) expect(r.channels[i].firstInvalidLine).toBe(c.firstInvalidLine);
        expect(r.channels[i].samples.length).toBe(f.rows);
        expect(r.channels[i].samples[0]).toBeCloseTo(f.first[i], 12);
      });
      if (f.preambleKeys) expect(r.layout.preamble.map((p) => p.key)).toEqual(f.preambleKeys);
    });
  }
});

describe('refusing bad input with the line where it went wrong', () => {
  for (const f of manifest.bad) {
    it(f.file, () => {
      let error: unknown;
      try {
        readCaptureBytes([bytes(f.file)]);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(CsvError);
      const e = error as CsvError;
      expect(e.code).toBe(f.code);
      expect(e.message.toLowerCase()).toContain(f.message.toLowerCase());
      expect(e.line).toBe(f.line);
    });
  }
});

describe('streaming', () => {
  it('reads the same capture whatever the chunk boundaries (even inside a character or a CRLF)', () => {
    const all = bytes('dialects/semicolon-decimal-comma-preamble.csv');
    const whole = readCaptureBytes([all]);
    for (const size of [1, 2, 3, 7, 64]) {
      const chunks: Uint8Array[] = [];
      for (let i = 0; i < all.length; i += size) chunks.push(all.subarray(i, i + size));
      const r = readCaptureBytes(chunks);
      expect(Array.from(r.channels[1].samples)).toEqual(Array.from(whole.channels[1].samples));
    }
    const bom = bytes('dialects/comma-bom-crlf-seconds.csv');
    const split: Uint8Array[] = [];
    for (let i = 0; i < bom.length; i += 2) split.push(bom.subarray(i, i + 2));
    expect(readCaptureBytes(split).channels[0].samples[2]).toBe(230);
  });

  it('a sample rate given by the user serves a file without a time base', () => {
    const r = readCaptureBytes([bytes('bad/needs-sample-rate.csv')], { sampleRateHint: 2500 });
    expect(r.sampleRate).toBe(2500);
    expect(r.timeSource).toBe('given');
  });
});
