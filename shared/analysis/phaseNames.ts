/** What a channel name says about a phase: its family of labels, and one phase (to neutral) or two (line to line). */
export interface PhaseName {
  family: string;
  /** 0, 1, 2 for the first, second and third phase of the family. */
  phase: number;
  /** The second phase of a line-to-line name (L1-L2 → 1), else null. */
  to: number | null;
}

/** Label families in the order of their phases (IEC L1/L2/L3, A/B/C, R/S/T, U/V/W). */
const FAMILIES: Record<string, string[]> = { L: ['L1', 'L2', 'L3'], ABC: ['A', 'B', 'C'], RST: ['R', 'S', 'T'], UVW: ['U', 'V', 'W'] };
const TOKENS = new Map(Object.entries(FAMILIES).flatMap(([family, labels]) => labels.map((l, i) => [l, { family, phase: i }] as const)));
/** Digits alone only count after a quantity letter (V1, U2, I3): "CH1" must not pass for a phase. */
const DIGITS = new Map(['1', '2', '3'].map((d, i) => [d, { family: 'digits', phase: i }] as const));

/** Splits "L1L2", "AB", "L1-N", "AN" into phase tokens; returns null when something else is left. */
function tokens(s: string, table: Map<string, { family: string; phase: number }>): { family: string; phase: number }[] | null {
  const out: { family: string; phase: number }[] = [];
  let i = 0;
  while (i < s.length) {
    if (s[i] === '-') {
      i++;
      continue;
    }
    const two = table.get(s.slice(i, i + 2));
    const one = table.get(s[i]);
    if (two) {
      out.push(two);
      i += 2;
    } else if (one) {
      out.push(one);
      i += 1;
    } else if (s[i] === 'N' && i === s.length - 1 && out.length === 1) {
      i += 1;
    } else return null;
  }
  return out;
}

function fromTokens(t: { family: string; phase: number }[] | null): PhaseName | null {
  if (!t || t.length === 0 || t.length > 2) return null;
  if (t.length === 1) return { family: t[0].family, phase: t[0].phase, to: null };
  if (t[0].family !== t[1].family || t[0].phase === t[1].phase) return null;
  return { family: t[0].family, phase: t[0].phase, to: t[1].phase };
}

/**
 * Reads a phase from a channel name: "L1-N", "L2", "Va", "Van", "UL1", "IL3", "I b", "V-W", "L1-L2",
 * "Vab", "U1", "I2" and the like, ignoring case, spaces, a trailing unit in brackets and words such as
 * "voltage" or "phase". Null when the name names no phase. The name is at most 120 characters, and is
 * scanned by index (no regular expression runs over what a user typed).
 */
export function parsePhaseName(name: string): PhaseName | null {
  const bracket = name.indexOf('(');
  const s = (bracket >= 0 ? name.slice(0, bracket) : name)
    .slice(0, 120)
    .toUpperCase()
    .split(/[\s_./]+/)
    .filter((w) => w && w !== 'VOLTAGE' && w !== 'CURRENT' && w !== 'PHASE' && w !== 'LINE')
    .join('');
  if (!s) return null;
  // The name as it is first ("UV" is the line U-V), then without a leading quantity letter ("VA" is phase A).
  const plain = fromTokens(tokens(s, TOKENS));
  if (plain) return plain;
  if ('VUI'.includes(s[0]) && s.length > 1) {
    const rest = s.slice(s[1] === '-' ? 2 : 1);
    return fromTokens(tokens(rest, TOKENS)) ?? fromTokens(tokens(rest, DIGITS));
  }
  return null;
}
