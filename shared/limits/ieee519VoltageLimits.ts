/**
 * IEEE Std 519-2022, Table 1: voltage distortion limits at the point of common coupling, in % of the
 * rated power-frequency voltage. The values are those of IEEE Std 519-2014 Table 1, unchanged in 2022
 * (secondary texts reproducing both editions; not checked against the purchased standard).
 * Each row covers bus voltages above the previous row's bound up to and including its own.
 */
export const IEEE519_2022_TABLE_1 = [
  { upToVolts: 1_000, individualPercent: 5.0, thdPercent: 8.0, label: 'V ≤ 1.0 kV' },
  { upToVolts: 69_000, individualPercent: 3.0, thdPercent: 5.0, label: '1 kV < V ≤ 69 kV' },
  { upToVolts: 161_000, individualPercent: 1.5, thdPercent: 2.5, label: '69 kV < V ≤ 161 kV' },
  // Footnote: up to 2.0 % THD where an HVDC terminal's effect has decayed by the time it reaches users.
  { upToVolts: Infinity, individualPercent: 1.0, thdPercent: 1.5, label: 'V > 161 kV' },
] as const;

export type Ieee519VoltageRow = (typeof IEEE519_2022_TABLE_1)[number];

/**
 * The Table 1 row for a bus of the given nominal voltage (in V): 1000 V exactly is still "≤ 1.0 kV".
 * Throws for a voltage that is not a positive number.
 */
export function ieee519VoltageRow(nominalVolts: number): Ieee519VoltageRow {
  if (!(nominalVolts > 0)) throw new RangeError(`ieee519VoltageRow: the nominal voltage must be positive, got ${nominalVolts}`);
  return IEEE519_2022_TABLE_1.find((r) => nominalVolts <= r.upToVolts) ?? IEEE519_2022_TABLE_1[3];
}
