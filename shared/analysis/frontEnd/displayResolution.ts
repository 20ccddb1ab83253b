import type { ResolvedFrontEnd } from './resolveFrontEnd';

/**
 * One count of the display, a power of ten: on a fixed range, 10^⌈log₁₀(full scale / counts)⌉ (a
 * 6000-count display shows 600.0 V on its 600 V range and 1000 V in whole volts); auto-ranging, the
 * finest range that still holds the final reading. Null without counts (common practice, no source).
 */
export function displayResolution(p: ResolvedFrontEnd, finalReading: number): number | null {
  if (p.counts === null) return null;
  const exponent =
    p.rangeFullScale !== null ? Math.ceil(Math.log10(p.rangeFullScale / p.counts) - 1e-9)
    : finalReading > 0 ? Math.floor(Math.log10(Math.abs(finalReading) / p.counts) + 1e-9) + 1
    : null;
  return exponent === null ? null : 10 ** exponent;
}

/** A value as the display shows it: rounded to whole counts, or null (over-range) beyond a fixed range's full scale. */
export function displayed(value: number, resolution: number | null, fullScale: number | null): number | null {
  if (fullScale !== null && Math.abs(value) > fullScale) return null;
  if (resolution === null) return value;
  const decimals = Math.max(0, -Math.round(Math.log10(resolution)));
  return Number((Math.round(value / resolution) * resolution).toFixed(decimals));
}
