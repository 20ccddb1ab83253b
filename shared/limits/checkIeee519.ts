import type { ComplianceResult, ComplianceRow, Ieee519CurrentCheck, Ieee519VoltageCheck } from '../schemas/compliance';
import { siQuantityOf } from '../siUnits';
import { harmonicContent, notApplicable, percentRow, verdictOf, type ComplianceInput } from './complianceInput';
import { ieee519CurrentLimitPercent, ieee519CurrentRow, IEEE519_TABLE_2_VOLTS } from './ieee519CurrentLimits';
import { ieee519VoltageRow } from './ieee519VoltageLimits';
import { INDICATIVE_NOTE } from './indicative';
import { harmonicsByOrder, notJudgeableReason, unmeasuredNote } from './judgeable';
import type { z } from 'zod';

/** IEEE 519 limits harmonics up to order 50. */
const TOP = 50;
const orders = Array.from({ length: TOP - 1 }, (_, i) => i + 2);

/**
 * Voltage distortion against IEEE Std 519-2022 Table 1: each harmonic in % of the nominal voltage, and
 * THD (orders 2…50 over the fundamental, the standard's definition of THD).
 */
export function checkIeee519Voltage(input: ComplianceInput, req: z.infer<typeof Ieee519VoltageCheck>): ComplianceResult {
  const row = ieee519VoltageRow(req.nominalVoltage);
  const standard = `IEEE Std 519-2022, Table 1 (voltage distortion), bus ${row.label}`;
  const si = siQuantityOf(input.unit);
  if (si?.quantity !== 'voltage') return notApplicable(standard, `The channel is in “${input.unit || 'no unit'}”; a voltage check needs volts.`);
  const reason = notJudgeableReason(input.analysis);
  if (reason) return notApplicable(standard, reason);
  const measured = harmonicsByOrder(input.analysis, si.factor);
  const v1 = measured.get(1)!;
  const rows: ComplianceRow[] = orders.map((h) => percentRow(h, measured.get(h), req.nominalVoltage, row.individualPercent));
  const content = harmonicContent(measured, TOP);
  const thd = (100 * content) / v1;
  rows.push({ quantity: 'thd', order: null, measured: content, measuredPercent: thd, limit: null, limitPercent: row.thdPercent, pass: thd <= row.thdPercent });
  const notes = [
    INDICATIVE_NOTE,
    'Individual harmonics are in % of the nominal voltage you gave; THD is against the measured fundamental.',
    'IEEE 519 judges the daily 99th percentile of 3 s values against 1.5 × these limits and the weekly 95th percentile of 10 min values against them; one capture shows neither.',
  ];
  if (Math.abs(v1 - req.nominalVoltage) > 0.1 * req.nominalVoltage) {
    notes.push(`The measured fundamental (${v1.toPrecision(4)} V) is more than 10 % from the nominal voltage (${req.nominalVoltage} V): check the nominal voltage (line-to-neutral for a line-to-neutral channel) and the probe's scaling.`);
  }
  const missing = unmeasuredNote(measured, TOP);
  if (missing) notes.push(missing);
  return { verdict: verdictOf(rows), standard, reason: null, basis: { of: 'nominalVoltage', value: req.nominalVoltage, unit: 'V' }, rows, notes };
}

/**
 * Current distortion against IEEE Std 519-2014 Table 2 (numbers unchanged in 2022): each harmonic and
 * TDD in % of the maximum demand load current I_L, by the ratio I_SC/I_L; even orders at 25 %.
 */
export function checkIeee519Current(input: ComplianceInput, req: z.infer<typeof Ieee519CurrentCheck>): ComplianceResult {
  const row = ieee519CurrentRow(req.iscIl);
  const standard = `IEEE Std 519-2014, Table 2 (current distortion, 120 V to 69 kV), I_SC/I_L ${row.label}`;
  const si = siQuantityOf(input.unit);
  if (si?.quantity !== 'current') return notApplicable(standard, `The channel is in “${input.unit || 'no unit'}”; a current check needs amperes.`);
  if (req.nominalVoltage < IEEE519_TABLE_2_VOLTS.min || req.nominalVoltage > IEEE519_TABLE_2_VOLTS.max) {
    return notApplicable(standard, `Table 2 covers systems of 120 V to 69 kV; ${req.nominalVoltage} V is outside it (Tables 3 and 4, above 69 kV, are not included).`);
  }
  const reason = notJudgeableReason(input.analysis);
  if (reason) return notApplicable(standard, reason);
  const measured = harmonicsByOrder(input.analysis, si.factor);
  const il = req.loadCurrent;
  const rows: ComplianceRow[] = orders.map((h) => percentRow(h, measured.get(h), il, ieee519CurrentLimitPercent(h, row)));
  const content = harmonicContent(measured, TOP);
  const tdd = (100 * content) / il;
  rows.push({ quantity: 'tdd', order: null, measured: content, measuredPercent: tdd, limit: null, limitPercent: row.tddPercent, pass: tdd <= row.tddPercent });
  const notes = [
    INDICATIVE_NOTE,
    'Harmonics and TDD are in % of the load current I_L you gave (the maximum demand current, fundamental, at the PCC).',
    'Even harmonics are held to 25 % of the odd limits (the 2014 rule); IEEE Std 519-2022 relaxes this to 50 % for orders up to 6 and 100 % above.',
    'Power-generation equipment is held to the I_SC/I_L < 20 row whatever its ratio.',
  ];
  const i1 = measured.get(1)!;
  if (i1 > il) notes.push(`The measured fundamental (${i1.toPrecision(4)} A) exceeds the load current I_L you gave (${il} A); I_L is the maximum demand current, so check it.`);
  const dc = Math.abs(input.analysis.mean * si.factor);
  if (dc > 0.01 * il) notes.push(`A DC part of ${dc.toPrecision(3)} A was measured: IEEE 519 does not allow current distortion that results in a DC offset.`);
  const missing = unmeasuredNote(measured, TOP);
  if (missing) notes.push(missing);
  return { verdict: verdictOf(rows), standard, reason: null, basis: { of: 'loadCurrent', value: il, unit: 'A' }, rows, notes };
}
