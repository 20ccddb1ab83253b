import type { ComplianceResult, ComplianceRow } from '../schemas/compliance';

/** A row's limit in V or A, whether the standard states it in amperes or in % of the check's basis. */
export function limitValueOf(row: ComplianceRow, basis: ComplianceResult['basis']): number | null {
  if (row.limit !== null) return row.limit;
  if (row.limitPercent !== null && basis) return (row.limitPercent / 100) * basis.value;
  return null;
}

/**
 * The limit of each harmonic order in % of the measured fundamental (given in V or A), for drawing a
 * limit line over bars scaled to the fundamental. Totals (THD, TDD) have no place on such a chart.
 */
export function limitPercentOfFundamental(result: ComplianceResult, fundamental: number): Map<number, number> {
  const out = new Map<number, number>();
  if (!(fundamental > 0)) return out;
  for (const r of result.rows) {
    const v = r.quantity === 'harmonic' && r.order !== null ? limitValueOf(r, result.basis) : null;
    if (v !== null) out.set(r.order!, (100 * v) / fundamental);
  }
  return out;
}
