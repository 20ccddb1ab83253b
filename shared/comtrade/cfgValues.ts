import type { ComtradeTimestamp } from './ComtradeConfig';

const isDigit = (c: number) => c >= 48 && c <= 57;

/**
 * A plain decimal number of a .cfg field ("-12", "0.5", "1.2E-3"), or NaN for anything else. Number()
 * alone would take "", " ", "0x1F" and "Infinity"; the scan by index keeps to decimals without a
 * regular expression (which would backtrack on long digit runs).
 */
export function decimalText(s: string): number {
  const t = s.trim();
  let i = 0;
  const skipDigits = () => {
    const from = i;
    while (isDigit(t.charCodeAt(i))) i++;
    return i - from;
  };
  if (t.charCodeAt(i) === 43 || t.charCodeAt(i) === 45) i++;
  let digits = skipDigits();
  if (t.charCodeAt(i) === 46) {
    i++;
    digits += skipDigits();
  }
  if (digits === 0) return NaN;
  if (t.charCodeAt(i) === 69 || t.charCodeAt(i) === 101) {
    i++;
    if (t.charCodeAt(i) === 43 || t.charCodeAt(i) === 45) i++;
    if (skipDigits() === 0) return NaN;
  }
  return i === t.length ? Number(t) : NaN;
}

/** Digits only, as a number; NaN when anything else is there or it is empty. */
function digitsOf(s: string): number {
  if (s.length === 0 || s.length > 9) return NaN;
  for (let i = 0; i < s.length; i++) if (!isDigit(s.charCodeAt(i))) return NaN;
  return Number(s);
}

/**
 * The date and time of a .cfg line, `dd/mm/yyyy` and `hh:mm:ss.ssssss` (1999 clause 6.4.7, from memory;
 * the 2013 edition allows up to nine fraction digits, from memory). Returns null for a value that is
 * not such a date, which the caller reports with its line.
 */
export function comtradeTimestamp(date: string, time: string): ComtradeTimestamp | null {
  const d = date.trim().split('/');
  const t = time.trim().split(':');
  if (d.length !== 3 || t.length !== 3 || d[2].length !== 4) return null;
  const [day, month, year] = d.map(digitsOf);
  const [hours, minutes] = [digitsOf(t[0]), digitsOf(t[1])];
  const [whole, fraction = ''] = t[2].split('.');
  const seconds = digitsOf(whole);
  const fractionValue = fraction === '' ? 0 : digitsOf(fraction);
  if ([day, month, year, hours, minutes, seconds, fractionValue].some(Number.isNaN) || fraction.length > 9) return null;
  // Seconds up to 60: a leap second is a valid time stamp.
  if (year < 1000 || month < 1 || month > 12 || day < 1 || hours > 23 || minutes > 59 || seconds > 60) return null;
  const daysInMonth = new Date(Date.UTC(year, month, 0)).getUTCDate();
  if (day > daysInMonth) return null;
  const secondMs = Date.UTC(year, month - 1, day, hours, minutes, 0) + seconds * 1000;
  return { text: `${date.trim()},${time.trim()}`, secondMs, nanos: fractionValue * 10 ** (9 - fraction.length) };
}

/** later − earlier in seconds, without losing the nanoseconds to the size of an epoch time. */
export const secondsBetween = (earlier: ComtradeTimestamp, later: ComtradeTimestamp) => (later.secondMs - earlier.secondMs) / 1000 + (later.nanos - earlier.nanos) / 1e9;
