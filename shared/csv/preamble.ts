import { normaliseUnit, timeUnitScale } from './columnHeader';
import { cleanCell } from './numberCells';
import { splitLine, type Delimiter } from './splitLine';
import { isSpace, leadingMark } from './textScan';

export interface PreambleEntry {
  key: string;
  value: string;
  line: number;
}

const COMMENT_MARKS = ['#', '%', '//', ';'];
const NUMBER_START = '-+.0123456789';
const NUMERIC = '0123456789.,+-';

/**
 * `key: value` or `key = value`: a key holding none of `stops`, then a colon or an equals sign, with only
 * whitespace (a tab among `stops` included) between them. The value is returned as written.
 */
function splitAtMark(text: string, stops: string): { key: string; value: string } | null {
  for (let i = 0; i < text.length; i++) {
    if (!stops.includes(text[i])) continue;
    let mark = i;
    while (mark < text.length && isSpace(text.charCodeAt(mark))) mark++;
    if (i === 0 || (text[mark] !== ':' && text[mark] !== '=')) return null;
    return { key: text.slice(0, i).trim(), value: text.slice(mark + 1) };
  }
  return null;
}

/**
 * Whitespace-separated `Sample interval  2e-6`: the key runs to the end of the first word that holds a
 * non-numeric character and is followed by a value starting like a number. One pass over the text.
 */
function splitAtNumber(text: string): { key: string; value: string } | null {
  let i = 0;
  while (i < text.length) {
    let textual = false;
    for (; i < text.length && !isSpace(text.charCodeAt(i)); i++) if (!NUMERIC.includes(text[i])) textual = true;
    const wordEnd = i;
    while (i < text.length && isSpace(text.charCodeAt(i))) i++;
    if (textual && i > wordEnd && i < text.length && NUMBER_START.includes(text[i])) return { key: text.slice(0, wordEnd).trim(), value: text.slice(i).trim() };
  }
  return null;
}

/** Key/value lines before the data: `key,value`, `key: value`, `key = value`, with `#`, `%` or `//` comments stripped. */
export function parsePreambleLine(raw: string, line: number, delimiter: Delimiter): PreambleEntry | null {
  const text = raw.slice(leadingMark(raw, COMMENT_MARKS)?.end ?? 0).trim();
  if (!text) return null;
  const colon = splitAtMark(text, ':=,;\t');
  if (colon) return { key: colon.key, value: cleanCell(colon.value), line };
  if (delimiter === 'whitespace') {
    const words = splitAtNumber(text);
    return words ? { ...words, line } : { key: text, value: '', line };
  }
  const cells = splitLine(text, delimiter).map(cleanCell).filter((c) => c !== '');
  if (cells.length >= 2) {
    const key = cells[0];
    return { key: ':='.includes(key[key.length - 1]) ? key.slice(0, -1) : key, value: cells.slice(1).join(' '), line };
  }
  const kv = splitAtMark(text, ':=');
  if (kv) return { key: kv.key, value: kv.value.trim(), line };
  return { key: text, value: '', line };
}

const RATE_UNITS: Record<string, number> = { hz: 1, 's/s': 1, sa: 1, 'sa/s': 1, sps: 1, khz: 1e3, 'ks/s': 1e3, 'ksa/s': 1e3, ksps: 1e3, mhz: 1e6, 'ms/s': 1e6, 'msa/s': 1e6, msps: 1e6, ghz: 1e9, 'gs/s': 1e9, 'gsa/s': 1e9, gsps: 1e9 };

const isDigit = (c: number) => c >= 48 && c <= 57;

function digitsEnd(text: string, from: number): number {
  let i = from;
  while (i < text.length && isDigit(text.charCodeAt(i))) i++;
  return i;
}

const isUnitChar = (c: string) => (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') || c === 'µ' || c === 'μ' || c === '/';

/** A number with an optional unit, as preambles print it: "2.0E-06", "2 us", "500 kS/s", "1,5e-3 s". */
function numberWithUnit(value: string): { v: number; unit: string } | null {
  let i = 0;
  while (i < value.length && isSpace(value.charCodeAt(i))) i++;
  const start = i;
  if (value[i] === '-' || value[i] === '+') i++;
  const integerEnd = digitsEnd(value, i);
  const hasMark = value[integerEnd] === '.' || value[integerEnd] === ',';
  const fractionEnd = hasMark ? digitsEnd(value, integerEnd + 1) : integerEnd;
  // "5", "5.", "5,25" and ".5" are numbers; "." alone is not.
  if (integerEnd === i && fractionEnd <= integerEnd + 1) return null;
  i = fractionEnd;
  if (value[i] === 'e' || value[i] === 'E') {
    const signed = value[i + 1] === '-' || value[i + 1] === '+' ? i + 2 : i + 1;
    const exponentEnd = digitsEnd(value, signed);
    if (exponentEnd > signed) i = exponentEnd;
  }
  const v = Number(value.slice(start, i).replace(',', '.'));
  while (i < value.length && isSpace(value.charCodeAt(i))) i++;
  const unitStart = i;
  while (i < value.length && isUnitChar(value[i])) i++;
  return Number.isFinite(v) ? { v, unit: value.slice(unitStart, i) } : null;
}

/** The key without a trailing parenthesis: "Sample interval (s)" → "Sample interval". */
function keyWithoutParenthesis(key: string): string {
  const t = key.trimEnd();
  const open = t.indexOf('(');
  return open >= 0 && open < t.length - 1 && t.endsWith(')') ? t.slice(0, open).trim() : t.trim();
}

/** What the first non-empty parenthesis of a key holds: "Sample interval (us)" → "us". */
function parenthesised(key: string): string {
  for (let open = key.indexOf('('); open >= 0; open = key.indexOf('(', open + 1)) {
    const close = key.indexOf(')', open + 1);
    if (close < 0) return '';
    if (close > open + 1) return key.slice(open + 1, close);
  }
  return '';
}

const INTERVAL_KEYS = /^(sample ?interval|sampling ?interval|x ?increment|xinc|xincrement|dt|delta ?t|time ?step|sample ?period|sampling ?period|horizontal ?resolution|interval)$/i;
const RATE_KEYS = /^(sample ?rate|sampling ?rate|samples ?per ?second|fs|sampling ?frequency|sample ?frequency|acquisition ?rate)$/i;

/** The sample interval in seconds that a preamble states, directly or as a sample rate. */
export function intervalFromPreamble(entries: PreambleEntry[]): { seconds: number; key: string; line: number } | null {
  for (const e of entries) {
    const key = keyWithoutParenthesis(e.key);
    const n = numberWithUnit(e.value);
    if (!n || !(n.v > 0)) continue;
    const keyUnit = parenthesised(e.key);
    if (INTERVAL_KEYS.test(key)) {
      const scale = timeUnitScale(n.unit || keyUnit || 's');
      if (scale !== null) return { seconds: n.v * scale, key: e.key, line: e.line };
    }
    if (RATE_KEYS.test(key)) {
      const unit = (n.unit || keyUnit || 'hz').toLowerCase().replace('μ', 'µ');
      const scale = RATE_UNITS[unit];
      if (scale) return { seconds: 1 / (n.v * scale), key: e.key, line: e.line };
    }
  }
  return null;
}

/** A unit the preamble gives for the vertical axis, applied to channels whose header names none. */
export function unitFromPreamble(entries: PreambleEntry[]): string | null {
  // Anchored alternations of short words and a bounded class: constant work per entry.
  const e = entries.find((x) => /^(vertical ?units?|units?|y ?units?|unit ?of ?measure)$/i.test(x.key.trim()) && /^[A-Za-zµμ%°Ω]{1,6}$/.test(x.value.trim()));
  return e ? normaliseUnit(e.value) : null;
}
