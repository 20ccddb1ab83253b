/**
 * Preamble lines and the sample interval they state. Forms are those instruments print (common practice,
 * no source); the scans must give what the previous regular expressions gave (previousRegexes.ts).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { intervalFromPreamble, parsePreambleLine } from '../../../shared/csv/preamble';
import type { Delimiter } from '../../../shared/csv/splitLine';
import { previousIntervalFromPreamble, previousParsePreambleLine } from './previousRegexes';

const preambleChars = fc.constantFrom(...' \t()/"#%:=,;.+-eE0125VusSkHzaAmpl\u00a0'.split(''));
const shortText = fc.string({ unit: preambleChars, maxLength: 32 });
const delimiter = fc.constantFrom<Delimiter>(',', ';', '\t', 'whitespace');

describe('parsePreambleLine', () => {
  it.each<[string, Delimiter, string, string]>([
    ['# Sample rate: 10 kS/s', ',', 'Sample rate', '10 kS/s'],
    ['Record length;6', ';', 'Record length', '6'],
    ['Sample interval = 2e-6', ',', 'Sample interval', '2e-6'],
    ['// Probe: 10:1', ',', 'Probe', '10:1'],
    ['% Units = V', '\t', 'Units', 'V'],
    ['X Increment,2.0E-04', ',', 'X Increment', '2.0E-04'],
    ['"Gain, CH1:",2', ',', 'Gain, CH1', '2'],
    ['Probe\t: 10:1', '\t', 'Probe', '10:1'],
    ['Sample interval   2e-6', 'whitespace', 'Sample interval', '2e-6'],
    ['Logger export (invented)', 'whitespace', 'Logger export (invented)', ''],
  ])('%j with delimiter %j → %j = %j', (line, d, key, value) => {
    expect(parsePreambleLine(line, 7, d)).toEqual({ key, value, line: 7 });
  });

  it('a blank or bare comment line is no entry', () => {
    expect(parsePreambleLine('  # ', 1, ',')).toBeNull();
  });

  it('agrees with the previous regular expressions on short lines', () => {
    fc.assert(
      fc.property(shortText, delimiter, (t, d) => void expect(parsePreambleLine(t, 3, d)).toEqual(previousParsePreambleLine(t, 3, d))),
      { numRuns: 5000 },
    );
  });
});

describe('intervalFromPreamble', () => {
  it.each([
    ['Sample interval', '0,5 ms', 5e-4],
    ['X Increment', '2.0E-04', 2e-4],
    ['Sample interval (us)', '2', 2e-6],
    ['Sample rate', '500 kS/s', 2e-6],
    ['Sample rate', '10 kHz', 1e-4],
    ['fs', '.5e3', 2e-3],
  ])('%j = %j is %f s', (key, value, seconds) => {
    expect(intervalFromPreamble([{ key, value, line: 1 }])?.seconds).toBeCloseTo(seconds, 15);
  });

  it('agrees with the previous regular expressions on short keys and values', () => {
    const key = fc.oneof(shortText, fc.constantFrom('Sample interval', 'Sample rate', 'fs', 'dt').chain((k) => fc.tuple(fc.constant(k), shortText).map(([a, b]) => a + b)));
    const value = fc.oneof(shortText, fc.tuple(fc.double({ min: 1e-9, max: 1e9, noNaN: true }).map(String), shortText).map(([a, b]) => a + b));
    fc.assert(
      fc.property(key, value, (k, v) => void expect(intervalFromPreamble([{ key: k, value: v, line: 1 }])).toEqual(previousIntervalFromPreamble([{ key: k, value: v, line: 1 }]))),
      { numRuns: 5000 },
    );
  });
});
