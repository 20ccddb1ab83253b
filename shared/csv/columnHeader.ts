import { isSpace, unwrap } from './textScan';

export interface ColumnHeader {
  name: string;
  unit: string;
}

const OPENERS = '([{';
const CLOSERS = ')]}';

/**
 * `name (unit)`, `name [unit]` or `name {unit}`: the title ends with a closing bracket, and the unit starts
 * after the first opening bracket that follows every other closing one. Linear in the title.
 */
function splitBracketed(text: string): ColumnHeader | null {
  const close = text.length - 1;
  if (close < 1 || !CLOSERS.includes(text[close])) return null;
  let open = -1;
  for (let i = close - 1; i >= 0 && !CLOSERS.includes(text[i]); i--) if (OPENERS.includes(text[i])) open = i;
  const name = open > 0 ? text.slice(0, open).trim() : '';
  return name ? { name, unit: normaliseUnit(text.slice(open + 1, close)) } : null;
}

/** A unit after a slash: a letter-like first character, at most 12 characters. Tested only on that many. */
const SLASHED_UNIT = /^[A-Za-zµμ°%Ω][\w µμ°%Ω/.^*-]{0,11}$/;

/**
 * `name/unit` or `name / unit`: the first slash that has a name ending in neither a space nor a slash
 * before it and nothing but a short unit after it. Linear: each space run is skipped from one slash only.
 */
function splitSlashed(text: string): ColumnHeader | null {
  for (let slash = text.indexOf('/'); slash >= 0; slash = text.indexOf('/', slash + 1)) {
    let unitStart = slash + 1;
    while (unitStart < text.length && isSpace(text.charCodeAt(unitStart))) unitStart++;
    if (text.length - unitStart > 12 || !SLASHED_UNIT.test(text.slice(unitStart))) continue;
    let nameEnd = slash;
    while (nameEnd > 0 && isSpace(text.charCodeAt(nameEnd - 1))) nameEnd--;
    if (nameEnd === 0 || text[nameEnd - 1] === '/') continue;
    return { name: text.slice(0, nameEnd).trim(), unit: normaliseUnit(text.slice(unitStart)) };
  }
  return null;
}

/** Splits a column title into name and unit: `CH1 (V)`, `CH1 [V]`, `CH1 {V}`, `CH1/V`, or a bare `CH1`. */
export function parseColumnHeader(raw: string): ColumnHeader {
  const text = unwrap(raw.trim(), '"', '"').trim();
  return splitBracketed(text) ?? splitSlashed(text) ?? { name: text, unit: '' };
}

/** µ written as the Greek mu or "u" becomes the micro sign. */
export function normaliseUnit(unit: string): string {
  const u = unwrap(unit.trim(), '"', '"').trim();
  // Anchored, one character and a look-ahead of one: constant work whatever the length.
  return u.replace(/^[uμ](?=[A-Za-z])/, 'µ');
}

const TIME_UNITS: Record<string, number> = { s: 1, sec: 1, second: 1, seconds: 1, ms: 1e-3, 'µs': 1e-6, us: 1e-6, ns: 1e-9, ps: 1e-12, min: 60 };

/** Seconds per unit of a time unit (`ms` → 0.001), or null when it is not one. */
export function timeUnitScale(unit: string): number | null {
  return TIME_UNITS[normaliseUnit(unit).toLowerCase().replace('μ', 'µ')] ?? TIME_UNITS[unit.trim().toLowerCase()] ?? null;
}

// The name and unit patterns below are anchored alternations of short words: the work is bounded by the
// longest word, whatever the length of the text tested.
const TIME_NAMES = /^(time|t|x|x-?axis|zeit|temps|tiempo|tempo|seconds?|timestamp|relative time|time ?stamp)$/i;
const INDEX_NAMES = /^(no\.?|nr\.?|index|idx|sample|samples|sample ?no\.?|point|pt|n|#|sequence)$/i;

export const looksLikeTimeName = (name: string) => TIME_NAMES.test(name.trim());
export const looksLikeIndexName = (name: string) => INDEX_NAMES.test(name.trim());

const UNIT = /^(?:[pnuµμmckMG]?(?:V|A|W|VA|var|VAR|Hz|s|Ω|Ohm|ohm|F|H|J|Wh|N|Pa|T)|°C|degC|K|%|dB|dBV|dBm|pu|p\.u\.|V\/div|A\/div|-|—)$/;

/** A cell of a separate units row: a unit as instruments print them (V, mV, A, kW, Hz, s, %...). */
export const looksLikeUnit = (cell: string) => UNIT.test(unwrap(unwrap(cell.trim(), '"', '"'), OPENERS, CLOSERS).trim());
