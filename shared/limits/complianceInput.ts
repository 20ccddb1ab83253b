import type { ChannelAnalysis } from '../schemas/analysis';
import type { ComplianceResult, ComplianceRow } from '../schemas/compliance';
import { INDICATIVE_NOTE } from './indicative';

/** What a limit check reads: one channel's stored analysis, and the Power figures when it is paired. */
export interface ComplianceInput {
  analysis: ChannelAnalysis;
  /** The channel's unit as stored ('V', 'kV', 'A', 'mA', …). */
  unit: string;
  /** Active power in W and power factor of this channel paired with a voltage channel; null when unpaired. */
  power: { activePower: number; powerFactor: number | null } | null;
}

/** A not-applicable answer with its reason. */
export function notApplicable(standard: string, reason: string): ComplianceResult {
  return { verdict: 'not-applicable', standard, reason, basis: null, rows: [], notes: [INDICATIVE_NOTE] };
}

/** Fail when any judged row fails, else pass. */
export function verdictOf(rows: ComplianceRow[]): 'pass' | 'fail' {
  return rows.some((r) => r.pass === false) ? 'fail' : 'pass';
}

/** RMS of orders 2…top: the harmonic content that THD and TDD put over their base. */
export function harmonicContent(measured: Map<number, number>, top: number): number {
  let sq = 0;
  for (const [order, v] of measured) if (order >= 2 && order <= top) sq += v * v;
  return Math.sqrt(sq);
}

/** A harmonic row judged against a limit in % of `base`; not judged where the order was not measured. */
export function percentRow(order: number, measured: number | undefined, base: number, limitPercent: number): ComplianceRow {
  if (measured === undefined) return { quantity: 'harmonic', order, measured: null, measuredPercent: null, limit: null, limitPercent, pass: null };
  const measuredPercent = (100 * measured) / base;
  return { quantity: 'harmonic', order, measured, measuredPercent, limit: null, limitPercent, pass: measuredPercent <= limitPercent };
}
