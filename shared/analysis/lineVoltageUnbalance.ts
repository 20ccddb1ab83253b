/**
 * Line-voltage unbalance by North American practice (NEMA MG 1): the largest deviation of a line
 * voltage from the average of the three, over that average, in %. Null when the average is zero.
 *
 * @param lineVoltages the three line-to-line RMS voltages, in V
 */
export function maxDeviationUnbalance(lineVoltages: readonly [number, number, number]): number | null {
  const avg = (lineVoltages[0] + lineVoltages[1] + lineVoltages[2]) / 3;
  if (!(avg > 0)) return null;
  return (100 * Math.max(...lineVoltages.map((v) => Math.abs(v - avg)))) / avg;
}

/**
 * The negative-sequence unbalance u2 (in %) from the three line-to-line magnitudes alone, with no
 * phase angles: β = ΣU⁴/(ΣU²)², u2 = √((1 − √(3 − 6β))/(1 + √(3 − 6β))). Line-to-line voltages carry no
 * zero sequence, so three magnitudes fix u2. Used as a cross-check of the phasor route.
 */
export function unbalanceFromLineMagnitudes(lineVoltages: readonly [number, number, number]): number | null {
  const sq = lineVoltages.map((u) => u * u);
  const s2 = sq[0] + sq[1] + sq[2];
  if (!(s2 > 0)) return null;
  const beta = (sq[0] ** 2 + sq[1] ** 2 + sq[2] ** 2) / (s2 * s2);
  const r = Math.sqrt(Math.max(0, 3 - 6 * beta));
  return 100 * Math.sqrt((1 - r) / (1 + r));
}
