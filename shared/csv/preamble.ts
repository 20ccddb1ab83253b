import { normaliseUnit, timeUnitScale } from './columnHeader';
import { cleanCell } from './numberCells';
import { splitLine, type Delimiter } from './splitLine';

export interface PreambleEntry {
  key: string;
  value: string;
  line: number;
}

/** Key/value lines before the data: `key,value`, `key: value`, `key = value`, with `#`, `%` or `//` comments stripped. */
export function parsePreambleLine(raw: string, line: number, delimiter: Delimiter): PreambleEntry | null {
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

/** A number with an optional unit, as preambles print it: "2.0E-06", "2 us", "500 kS/s", "1,5e-3 s". */
function numberWithUnit(value: string): { v: number; unit: string } | null {
  const m = /^\s*([-+]?(?:\d+[.,]?\d*|[.,]\d+)(?:[eE][-+]?\d+)?)\s*([A-Za-zµμ/]*)/.exec(value);
  if (!m) return null;
  const v = Number(m[1].replace(',', '.'));
  return Number.isFinite(v) ? { v, unit: m[2] } : null;
}

const INTERVAL_KEYS = /^(sample ?interval|sampling ?interval|x ?increment|xinc|xincrement|dt|delta ?t|time ?step|sample ?period|sampling ?period|horizontal ?resolution|interval)$/i;
const RATE_KEYS = /^(sample ?rate|sampling ?rate|samples ?per ?second|fs|sampling ?frequency|sample ?frequency|acquisition ?rate)$/i;

/** The sample interval in seconds that a preamble states, directly or as a sample rate. */
export function intervalFromPreamble(entries: PreambleEntry[]): { seconds: number; key: string; line: number } | null {
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

/** A unit the preamble gives for the vertical axis, applied to channels whose header names none. */
export function unitFromPreamble(entries: PreambleEntry[]): string | null {
  const e = entries.find((x) => /^(vertical ?units?|units?|y ?units?|unit ?of ?measure)$/i.test(x.key.trim()) && /^[A-Za-zµμ%°Ω]{1,6}$/.test(x.value.trim()));
  return e ? normaliseUnit(e.value) : null;
}
