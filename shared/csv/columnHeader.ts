export interface ColumnHeader {
  name: string;
  unit: string;
}

const BRACKETED = /^(.*?)\s*[([{]\s*([^)\]}]*?)\s*[)\]}]\s*$/;
const SLASHED = /^(.*?[^\s/])\s*\/\s*([A-Za-zµμ°%Ω][\w µμ°%Ω/.^*-]{0,11})$/;

/** Splits a column title into name and unit: `CH1 (V)`, `CH1 [V]`, `CH1 {V}`, `CH1/V`, or a bare `CH1`. */
export function parseColumnHeader(raw: string): ColumnHeader {
  const text = raw.trim().replace(/^"(.*)"$/, '$1').trim();
  const bracketed = BRACKETED.exec(text);
  if (bracketed && bracketed[1]) return { name: bracketed[1].trim(), unit: normaliseUnit(bracketed[2]) };
  const slashed = SLASHED.exec(text);
  if (slashed) return { name: slashed[1].trim(), unit: normaliseUnit(slashed[2]) };
  return { name: text, unit: '' };
}

/** µ written as the Greek mu or "u" becomes the micro sign. */
export function normaliseUnit(unit: string): string {
  const u = unit.trim().replace(/^"(.*)"$/, '$1').trim();
  return u.replace(/^[uμ](?=[A-Za-z])/, 'µ');
}

const TIME_UNITS: Record<string, number> = { s: 1, sec: 1, second: 1, seconds: 1, ms: 1e-3, 'µs': 1e-6, us: 1e-6, ns: 1e-9, ps: 1e-12, min: 60 };

/** Seconds per unit of a time unit (`ms` → 0.001), or null when it is not one. */
export function timeUnitScale(unit: string): number | null {
  return TIME_UNITS[normaliseUnit(unit).toLowerCase().replace('μ', 'µ')] ?? TIME_UNITS[unit.trim().toLowerCase()] ?? null;
}

const TIME_NAMES = /^(time|t|x|x-?axis|zeit|temps|tiempo|tempo|seconds?|timestamp|relative time|time ?stamp)$/i;
const INDEX_NAMES = /^(no\.?|nr\.?|index|idx|sample|samples|sample ?no\.?|point|pt|n|#|sequence)$/i;

export const looksLikeTimeName = (name: string) => TIME_NAMES.test(name.trim());
export const looksLikeIndexName = (name: string) => INDEX_NAMES.test(name.trim());

const UNIT = /^(?:[pnuµμmckMG]?(?:V|A|W|VA|var|VAR|Hz|s|Ω|Ohm|ohm|F|H|J|Wh|N|Pa|T)|°C|degC|K|%|dB|dBV|dBm|pu|p\.u\.|V\/div|A\/div|-|—)$/;

/** A cell of a separate units row: a unit as instruments print them (V, mV, A, kW, Hz, s, %...). */
export const looksLikeUnit = (cell: string) => {
  const c = cell.trim().replace(/^"(.*)"$/, '$1').replace(/^[([{](.*)[)\]}]$/, '$1').trim();
  return UNIT.test(c);
};
