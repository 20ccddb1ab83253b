const PREFIXES: [number, string][] = [
  [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'],
];

/** Units that take SI prefixes; others (%, °C, dimensionless ratios) print as they are. */
const PREFIXABLE = /^(V|A|W|VA|var|Hz|s|Ω|F|H|J|Wh)$/;

/**
 * A value with an SI prefix and `digits` significant figures: 0.0123 A → "12.3 mA", 230.04 V → "230.0 V".
 * Null or non-finite values print as an em dash.
 */
export function formatSI(value: number | null | undefined, unit = '', digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return unit ? `0 ${unit}` : '0';
  if (!PREFIXABLE.test(unit)) return `${Number(value.toPrecision(digits))}${unit ? ` ${unit}` : ''}`;
  const abs = Math.abs(value);
  const [scale, prefix] = PREFIXES.find(([s]) => abs >= s * 0.9995) ?? PREFIXES[PREFIXES.length - 1];
  const scaled = value / scale;
  const intDigits = Math.max(1, Math.floor(Math.log10(Math.abs(scaled))) + 1);
  return `${scaled.toFixed(Math.max(0, digits - intDigits))} ${prefix}${unit}`;
}

/** A ratio such as a crest or form factor, to `digits` significant figures. */
export const formatRatio = (v: number | null | undefined, digits = 4) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toPrecision(digits));

/** A signed percentage with one or two decimals: "+11.07 %". */
export function formatPercent(v: number | null | undefined, decimals = 2): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const s = v.toFixed(decimals);
  return `${v > 0 ? '+' : ''}${s === '-0.00' ? '0.00' : s} %`;
}
