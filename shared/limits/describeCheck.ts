import type { ComplianceRequest, ComplianceRow } from '../schemas/compliance';

/** A check's parameters in words: "IEEE 519 voltage, nominal 230 V". */
export function describeCheck(req: ComplianceRequest): string {
  if (req.standard === 'iec61000-3-2') {
    const extra = [req.activePower !== undefined ? `active power ${req.activePower} W` : null, req.powerFactor !== undefined ? `λ = ${req.powerFactor}` : null].filter(Boolean);
    return `IEC 61000-3-2 Class ${req.class}${extra.length ? `, ${extra.join(', ')}` : ''}`;
  }
  if (req.kind === 'current') return `IEEE 519 current, nominal ${req.nominalVoltage} V, I_SC/I_L ${req.iscIl}, I_L ${req.loadCurrent} A`;
  return `IEEE 519 voltage, nominal ${req.nominalVoltage} V`;
}

/** A row's name: its order, or THD / TDD for a total. */
export const rowName = (r: ComplianceRow) => (r.quantity === 'harmonic' ? String(r.order) : r.quantity.toUpperCase());

/** A verdict in words, as reports and the screen print it. */
export const verdictWord = { pass: 'Pass', fail: 'Fail', 'not-applicable': 'Not applicable' } as const;
