import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readByteNumber } from '../../../shared/csv/byteNumber';
import { readCaptureBytes } from '../../../shared/csv/readCaptureBytes';

/**
 * The byte-level reader must give exactly what `Number()` gives for the same text: ECMAScript's
 * Number() rounds every decimal string correctly (ECMA-262, "StringToNumber"; IEEE 754 round to
 * nearest, ties to even), so it is the independent reference here.
 */
const encoder = new TextEncoder();

function parse(text: string, decimalMark = 46): number | null {
  const bytes = encoder.encode(text);
  const out = { value: 0, end: 0 };
  return readByteNumber(bytes, 0, bytes.length, decimalMark, out) && out.end === bytes.length ? out.value : null;
}

const digits = (min: number, max: number) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: min, maxLength: max });

/** Every notation the reader accepts: sign, integer digits, a decimal mark with digits, an exponent. */
const numericText = fc
  .record({
    sign: fc.constantFrom('', '-', '+'),
    whole: digits(0, 25),
    fraction: fc.option(digits(0, 25), { nil: undefined }),
    exponent: fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '-', '+'), digits(1, 4)), { nil: undefined }),
  })
  .filter((r) => r.whole.length > 0 || (r.fraction?.length ?? 0) > 0)
  .map((r) => `${r.sign}${r.whole}${r.fraction !== undefined ? `.${r.fraction}` : ''}${r.exponent ? r.exponent.join('') : ''}`);

describe('readByteNumber', () => {
  it('gives bit-identical results to Number() for a million random numbers in every notation', () => {
    fc.assert(
      fc.property(numericText, (text) => Object.is(parse(text), Number(text))),
      { numRuns: 1_000_000 },
    );
  });

  it('reads a decimal comma as Number() reads the same number with a point', () => {
    fc.assert(fc.property(numericText, (text) => Object.is(parse(text.replace('.', ','), 44), Number(text))), { numRuns: 100_000 });
  });

  it.each([
    ['17+ significant digits', '0.30000000000000004441'],
    ['17+ digits before the point', '123456789012345678901234567890'],
    ['just above 2^53', '9007199254740993'],
    ['the smallest subnormal', '4.9406564584124654e-324'],
    ['a subnormal', '2.2250738585072011e-308'],
    ['the smallest normal', '2.2250738585072014e-308'],
    ['the largest double', '1.7976931348623157e308'],
    ['overflow to infinity', '1e309'],
    ['underflow to zero', '1e-400'],
    ['a huge exponent with leading zeros', '1e0000000000001'],
    ['negative zero', '-0'],
    ['negative zero with a fraction and exponent', '-0.000e+5'],
    ['positive zero', '+0.0'],
    ['no integer digits', '.5'],
    ['no fraction digits', '5.'],
    ['a halfway case (ties to even)', '9007199254740993.0'],
  ])('%s: %s', (_name, text) => {
    expect(Object.is(parse(text), Number(text))).toBe(true);
  });

  it('refuses what is not a plain number: markers, hex, a bare sign or exponent', () => {
    for (const text of ['', '-', '+', '.', 'e5', 'NaN', 'OL', '0x1F', 'Infinity', '1e', '1e+']) expect(parse(text), text).toBeNull();
  });
});

describe('the byte-level body of readCaptureBytes', () => {
  const csv = (cells: string[]) => `Time (s),CH1 (V)\n${cells.map((c, i) => `${i},${c}`).join('\n')}\n`;

  it('reads every cell of a file exactly as Number() reads its text', () => {
    fc.assert(
      fc.property(fc.array(numericText, { minLength: 2, maxLength: 400 }), (cells) => {
        const finite = cells.filter((c) => Number.isFinite(Number(c)) && c.length <= 100);
        if (finite.length < 2) return true;
        const data = readCaptureBytes([encoder.encode(csv(finite))], { sampleRateHint: null });
        const got = data.channels[0].samples;
        return finite.every((c, i) => Object.is(got[i], Number(c)));
      }),
      { numRuns: 2_500 },
    );
  });

  it('reads a number split across a chunk boundary, at every possible split', () => {
    const text = csv(['-1.5', '2.25e-3', '0.30000000000000004441', '12345.678', '-0']);
    const bytes = encoder.encode(text);
    for (let cut = 1; cut < bytes.length; cut++) {
      const data = readCaptureBytes([bytes.subarray(0, cut), bytes.subarray(cut)]);
      expect(Array.from(data.channels[0].samples), `split at ${cut}`).toEqual([-1.5, 0.00225, 0.30000000000000004, 12345.678, -0]);
    }
  });

  it('reads a UTF-16 export, transcoded, with the same values', () => {
    const text = csv(['1.25', '-3.5', '7']);
    const utf16 = new Uint8Array(2 + text.length * 2);
    utf16.set([0xff, 0xfe]);
    for (let i = 0; i < text.length; i++) utf16[2 + 2 * i] = text.charCodeAt(i);
    const data = readCaptureBytes([utf16.subarray(0, 17), utf16.subarray(17)]);
    expect(data.encoding).toBe('utf-16le');
    expect(Array.from(data.channels[0].samples)).toEqual([1.25, -3.5, 7]);
  });
});
