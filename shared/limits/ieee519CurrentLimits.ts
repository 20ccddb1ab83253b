/**
 * IEEE Std 519-2014, Table 2: current distortion limits for systems rated 120 V through 69 kV, as the
 * maximum harmonic current in % of I_L (the maximum demand load current, fundamental) by the ratio
 * I_SC/I_L. The numbers are unchanged in IEEE Std 519-2022 (secondary texts reproducing both editions;
 * not checked against the purchased standard). Rows run from their lower bound inclusive to the next
 * row's bound exclusive ("20 < 50" read as 20 ≤ ratio < 50): our reading of the table's row labels.
 */
export const IEEE519_2014_TABLE_2 = [
  { fromRatio: 0, label: '< 20', bands: [4.0, 2.0, 1.5, 0.6, 0.3], tddPercent: 5.0 },
  { fromRatio: 20, label: '20 – 50', bands: [7.0, 3.5, 2.5, 1.0, 0.5], tddPercent: 8.0 },
  { fromRatio: 50, label: '50 – 100', bands: [10.0, 4.5, 4.0, 1.5, 0.7], tddPercent: 12.0 },
  { fromRatio: 100, label: '100 – 1000', bands: [12.0, 5.5, 5.0, 2.0, 1.0], tddPercent: 15.0 },
  { fromRatio: 1000, label: '> 1000', bands: [15.0, 7.0, 6.0, 2.5, 1.4], tddPercent: 20.0 },
] as const;

/** The order bands of Table 2's columns: 3 ≤ h < 11, 11 ≤ h < 17, 17 ≤ h < 23, 23 ≤ h < 35, 35 ≤ h ≤ 50. */
const BAND_STARTS = [11, 17, 23, 35] as const;

/** IEEE 519-2014: even harmonics are limited to 25 % of the odd-harmonic limits of their band. */
export const IEEE519_2014_EVEN_FACTOR = 0.25;

/** Table 2 applies from 120 V through 69 kV; Tables 3 and 4 (above 69 kV) are not included here. */
export const IEEE519_TABLE_2_VOLTS = { min: 120, max: 69_000 } as const;

export type Ieee519CurrentRow = (typeof IEEE519_2014_TABLE_2)[number];

/** The Table 2 row for a short-circuit ratio I_SC/I_L (> 0). */
export function ieee519CurrentRow(iscOverIl: number): Ieee519CurrentRow {
  if (!(iscOverIl > 0)) throw new RangeError(`ieee519CurrentRow: I_SC/I_L must be positive, got ${iscOverIl}`);
  let row: Ieee519CurrentRow = IEEE519_2014_TABLE_2[0];
  for (const r of IEEE519_2014_TABLE_2) if (iscOverIl >= r.fromRatio) row = r;
  return row;
}

/**
 * The limit of harmonic `order` (2…50) in % of I_L. Order 2 falls in the first band, as the 2022 edition
 * writes it (2 ≤ h < 11, from memory); even orders take 25 % of their band's odd limit.
 */
export function ieee519CurrentLimitPercent(order: number, row: Ieee519CurrentRow): number {
  if (!Number.isInteger(order) || order < 2 || order > 50) throw new RangeError(`ieee519CurrentLimitPercent: order must be 2…50, got ${order}`);
  const band = BAND_STARTS.filter((start) => order >= start).length;
  const odd = row.bands[band];
  return order % 2 === 0 ? odd * IEEE519_2014_EVEN_FACTOR : odd;
}
