import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CsvError } from '../../../shared/csv';
import { readCaptureBytes } from '../../../shared/csv/readCaptureBytes';

const encoder = new TextEncoder();

function readOrError(bytes: Uint8Array) {
  try {
    return readCaptureBytes([bytes]);
  } catch (e) {
    if (!(e instanceof CsvError)) throw e;
    if (e.code === 'invalid_csv') expect(e.line, e.message).toBeGreaterThan(0);
    return e;
  }
}

describe('the reader on anything', () => {
  it('arbitrary bytes: samples or a CsvError, never a crash', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 2000 }), (b) => void readOrError(b)), { numRuns: 300 });
  });

  it('arbitrary CSV-like text: samples or a CsvError with a line, never a crash', () => {
    const cell = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }).map(String), fc.constantFrom('', 'NaN', 'abc', '1,5', '"2.5"', ' 3 ', '-', '1e400', 'Time (s)', 'CH1 [V]'));
    const line = fc.array(cell, { maxLength: 6 }).chain((cells) => fc.constantFrom(',', ';', '\t', ' ').map((d) => cells.join(d)));
    const text = fc.array(line, { maxLength: 40 }).chain((lines) => fc.constantFrom('\n', '\r\n').map((br) => lines.join(br)));
    fc.assert(fc.property(text, (t) => void readOrError(encoder.encode(t))), { numRuns: 400 });
  });
});

const dialect = fc.record({
  delimiter: fc.constantFrom(',', ';', '\t', ' '),
  decimalComma: fc.boolean(),
  lineBreak: fc.constantFrom('\n', '\r\n'),
  bom: fc.boolean(),
  header: fc.constantFrom('parentheses', 'brackets', 'slash', 'unitsRow', 'none'),
  timeUnit: fc.constantFrom('s', 'ms', 'us', 'ns'),
  timeColumn: fc.boolean(),
});
const scale: Record<string, number> = { s: 1, ms: 1e3, us: 1e6, ns: 1e9 };

describe('round trip', () => {
  it('samples written in any supported dialect read back equal', () => {
    fc.assert(
      fc.property(
        dialect,
        fc.integer({ min: 1, max: 3 }),
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 12, maxLength: 60 }),
        fc.constantFrom(1000, 20000, 1e6),
        (d, channels, values, rate) => {
          if (d.decimalComma && d.delimiter === ',') d.decimalComma = false;
          const rows = Math.floor(values.length / channels);
          const num = (v: number) => (d.decimalComma ? String(v).replace('.', ',') : String(v));
          const names = Array.from({ length: channels }, (_, i) => `CH${i + 1}`);
          const lines: string[] = [];
          const withTime = d.timeColumn || d.header === 'none';
          if (!withTime) lines.push(`# Sample rate: ${rate} Hz`);
          const title = (name: string, unit: string) =>
            d.header === 'parentheses' ? `${name} (${unit})` : d.header === 'brackets' ? `${name} [${unit}]` : d.header === 'slash' ? `${name}/${unit}` : name;
          if (d.header !== 'none') {
            lines.push([...(withTime ? [title('Time', d.timeUnit)] : []), ...names.map((n) => title(n, 'V'))].join(d.delimiter));
            if (d.header === 'unitsRow') lines.push([...(withTime ? [d.timeUnit] : []), ...names.map(() => 'V')].join(d.delimiter));
          }
          for (let r = 0; r < rows; r++) {
            const t = (r / rate) * (d.header === 'none' ? 1 : scale[d.timeUnit]);
            const cells = values.slice(r * channels, (r + 1) * channels).map(num);
            lines.push([...(withTime ? [num(Number(t.toPrecision(12)))] : []), ...cells].join(d.delimiter));
          }
          const text = (d.bom ? '\ufeff' : '') + lines.join(d.lineBreak) + d.lineBreak;
          const read = readCaptureBytes([encoder.encode(text)]);
          expect(read.rows).toBe(rows);
          expect(read.channels.length).toBe(channels);
          expect(read.sampleRate / rate - 1).toBeLessThan(1e-9);
          for (let c = 0; c < channels; c++) {
            // String(-0) prints "0", as instruments do.
            const expected = Array.from({ length: rows }, (_, r) => values[r * channels + c] + 0);
            expect(Array.from(read.channels[c].samples)).toEqual(expected);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
