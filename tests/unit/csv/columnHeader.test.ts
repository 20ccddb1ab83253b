/**
 * Column titles and units cells. The title forms are those instruments print (common practice, no
 * source); the scans must give what the previous regular expressions gave (previousRegexes.ts).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { looksLikeUnit, parseColumnHeader } from '../../../shared/csv/columnHeader';
import { leadingMark } from '../../../shared/csv/textScan';
import { previousIsComment, previousLooksLikeUnit, previousParseColumnHeader } from './previousRegexes';

/**
 * Characters that steer the patterns, plus a no-break space and a BOM (both \s). Line terminators are
 * left out: the old `.` stopped at them, which no line of a file holds but a stray CR.
 */
const headerChars = fc.constantFrom(...' \t()[]{}/"#%:=,;.+-eE015VusSkxzµμ°Ω_^*C\u00a0\ufeff'.split(''));
const shortText = fc.string({ unit: headerChars, maxLength: 32 });

describe('parseColumnHeader', () => {
  it.each([
    ['CH1 (V)', 'CH1', 'V'],
    ['CH1 [mV]', 'CH1', 'mV'],
    ['CH1 {A}', 'CH1', 'A'],
    ['Time/us', 'Time', 'µs'],
    ['Time / ms', 'Time', 'ms'],
    ['"Input (V)"', 'Input', 'V'],
    ['Current ( A )', 'Current', 'A'],
    ['Gain (dB) (V)', 'Gain (dB)', 'V'],
    ['(V)', '(V)', ''],
    ['CH1', 'CH1', ''],
    ['U1/V', 'U1', 'V'],
    ['a/b/c', 'a', 'b/c'],
    ['CH1 (' + ' '.repeat(20) + 'x', 'CH1 (' + ' '.repeat(20) + 'x', ''],
  ])('%j → name %j, unit %j', (title, name, unit) => {
    expect(parseColumnHeader(title)).toEqual({ name, unit });
  });

  it('agrees with the previous regular expressions on short titles', () => {
    fc.assert(fc.property(shortText, (t) => void expect(parseColumnHeader(t)).toEqual(previousParseColumnHeader(t))), { numRuns: 5000 });
  });
});

describe('looksLikeUnit', () => {
  it.each(['V', 'mV', '(kW)', '[Hz]', '"µs"', 'p.u.', '%'])('%j is a unit', (cell) => expect(looksLikeUnit(cell)).toBe(true));
  it.each(['CH1', 'Volt', '(V', '12'])('%j is not', (cell) => expect(looksLikeUnit(cell)).toBe(false));

  it('agrees with the previous regular expressions on short cells', () => {
    const cell = fc.oneof(shortText, fc.constantFrom('V', 'mA', 'kHz', 'Ω', '°C').chain((u) => fc.constantFrom(u, `(${u})`, `[${u}}`, `"${u}"`, ` "(${u})" `)));
    fc.assert(fc.property(cell, (c) => void expect(looksLikeUnit(c)).toBe(previousLooksLikeUnit(c))), { numRuns: 3000 });
  });
});

describe('comment lines (leadingMark)', () => {
  it('agrees with the previous pattern for #, % and //', () => {
    fc.assert(fc.property(shortText, (t) => void expect(leadingMark(t, ['#', '%', '//']) !== null).toBe(previousIsComment(t))), { numRuns: 3000 });
  });
});
