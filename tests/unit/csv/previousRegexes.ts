/**
 * The regular expressions that shared/csv used before its head scans were rewritten by index, kept
 * verbatim as an oracle: on short inputs (where their backtracking costs nothing) the scans must agree
 * with them. Source: shared/csv/columnHeader.ts and preamble.ts at commit ac496e7.
 */
import { cleanCell } from '../../../shared/csv/numberCells';
import { splitLine, type Delimiter } from '../../../shared/csv/splitLine';
import { timeUnitScale } from '../../../shared/csv/columnHeader';

const BRACKETED = /^(.*?)\s*[([{]\s*([^)\]}]*?)\s*[)\]}]\s*$/;
const SLASHED = /^(.*?[^\s/])\s*\/\s*([A-Za-zµμ°%Ω][\w µμ°%Ω/.^*-]{0,11})$/;
const UNIT = /^(?:[pnuµμmckMG]?(?:V|A|W|VA|var|VAR|Hz|s|Ω|Ohm|ohm|F|H|J|Wh|N|Pa|T)|°C|degC|K|%|dB|dBV|dBm|pu|p\.u\.|V\/div|A\/div|-|—)$/;

export function previousNormaliseUnit(unit: string): string {
  const u = unit.trim().replace(/^"(.*)"$/, '$1').trim();
  return u.replace(/^[uμ](?=[A-Za-z])/, 'µ');
}

export function previousParseColumnHeader(raw: string): { name: string; unit: string } {
  const text = raw.trim().replace(/^"(.*)"$/, '$1').trim();
  const bracketed = BRACKETED.exec(text);
  if (bracketed && bracketed[1]) return { name: bracketed[1].trim(), unit: previousNormaliseUnit(bracketed[2]) };
  const slashed = SLASHED.exec(text);
  if (slashed) return { name: slashed[1].trim(), unit: previousNormaliseUnit(slashed[2]) };
  return { name: text, unit: '' };
}

export const previousLooksLikeUnit = (cell: string) =>
  UNIT.test(
    cell
      .trim()
      .replace(/^"(.*)"$/, '$1')
      .replace(/^[([{](.*)[)\]}]$/, '$1')
      .trim(),
  );

export const previousUnitsCell = (cell: string) => previousNormaliseUnit(cell.replace(/^[([](.*)[)\]]$/, '$1'));

export const previousIsComment = (line: string) => /^\s*(#|%|\/\/)/.test(line);

export function previousParsePreambleLine(raw: string, line: number, delimiter: Delimiter) {
  const text = raw.replace(/^\s*(#|%|\/\/|;)\s*/, '').trim();
  if (!text) return null;
  const colon = /^([^:=,;\t]+?)\s*[:=]\s*(.*)$/.exec(text);
  if (colon) return { key: colon[1].trim(), value: cleanCell(colon[2]), line };
  if (delimiter === 'whitespace') {
    const words = /^(.*?[^\s\d.,+-][^\s]*)\s+([-+.\d].*)$/.exec(text);
    return words ? { key: words[1].trim(), value: words[2].trim(), line } : { key: text, value: '', line };
  }
  const cells = splitLine(text, delimiter).map(cleanCell).filter((c) => c !== '');
  if (cells.length >= 2) return { key: cells[0].replace(/[:=]\s*$/, ''), value: cells.slice(1).join(' '), line };
  const kv = /^([^:=]+?)\s*[:=]\s*(.*)$/.exec(text);
  if (kv) return { key: kv[1].trim(), value: kv[2].trim(), line };
  return { key: text, value: '', line };
}

const RATE_UNITS: Record<string, number> = { hz: 1, 's/s': 1, sa: 1, 'sa/s': 1, sps: 1, khz: 1e3, 'ks/s': 1e3, 'ksa/s': 1e3, ksps: 1e3, mhz: 1e6, 'ms/s': 1e6, 'msa/s': 1e6, msps: 1e6, ghz: 1e9, 'gs/s': 1e9, 'gsa/s': 1e9, gsps: 1e9 };

function numberWithUnit(value: string): { v: number; unit: string } | null {
  const m = /^\s*([-+]?(?:\d+[.,]?\d*|[.,]\d+)(?:[eE][-+]?\d+)?)\s*([A-Za-zµμ/]*)/.exec(value);
  if (!m) return null;
  const v = Number(m[1].replace(',', '.'));
  return Number.isFinite(v) ? { v, unit: m[2] } : null;
}

const INTERVAL_KEYS = /^(sample ?interval|sampling ?interval|x ?increment|xinc|xincrement|dt|delta ?t|time ?step|sample ?period|sampling ?period|horizontal ?resolution|interval)$/i;
const RATE_KEYS = /^(sample ?rate|sampling ?rate|samples ?per ?second|fs|sampling ?frequency|sample ?frequency|acquisition ?rate)$/i;

export function previousIntervalFromPreamble(entries: { key: string; value: string; line: number }[]) {
  for (const e of entries) {
    const key = e.key.replace(/\s*\(.*\)\s*$/, '').trim();
    const n = numberWithUnit(e.value);
    if (!n || !(n.v > 0)) continue;
    const keyUnit = /\(([^)]+)\)/.exec(e.key)?.[1] ?? '';
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
