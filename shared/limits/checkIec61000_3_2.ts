import type { z } from 'zod';
import type { ComplianceResult, ComplianceRow, Iec61000_3_2Check } from '../schemas/compliance';
import { siQuantityOf } from '../siUnits';
import { notApplicable, verdictOf, type ComplianceInput } from './complianceInput';
import {
  CLASS_C_ABOVE_W,
  CLASS_D_POWER_W,
  classALimitAmps,
  classCLimitPercent,
  classDLimitAmps,
  IEC61000_3_2_DISREGARD,
  IEC61000_3_2_MAX_INPUT_A,
} from './iec61000_3_2Limits';
import { INDICATIVE_NOTE } from './indicative';
import { harmonicsByOrder, notJudgeableReason, unmeasuredNote } from './judgeable';

type Request = z.infer<typeof Iec61000_3_2Check>;
const TABLE = { A: 'Table 1 (Class A)', C: 'Table 2 (Class C, lighting)', D: 'Table 3 (Class D)' } as const;

/** A limit for one order: amperes (Classes A, D) or % of the fundamental (Class C); null where the class sets none. */
type OrderLimit = (order: number) => { amps: number } | { percent: number } | null;

/**
 * Equipment input current against IEC 61000-3-2 (equipment ≤ 16 A per phase), orders 2…40: Class A in
 * amperes, Class D in mA per watt of the active input power (capped at Class A), Class C in % of the
 * fundamental with the 3rd at 30 % × λ. Currents below 5 mA or 0.6 % of the input current are disregarded.
 */
export function checkIec61000_3_2(input: ComplianceInput, req: Request): ComplianceResult {
  const standard = `IEC 61000-3-2 Ed. 5.0 (2018) + Amd 1 (2020), ${TABLE[req.class]}`;
  const si = siQuantityOf(input.unit);
  if (si?.quantity !== 'current') return notApplicable(standard, `The channel is in “${input.unit || 'no unit'}”; an equipment input current check needs amperes.`);
  const inputCurrent = input.analysis.rms * si.factor;
  if (inputCurrent > IEC61000_3_2_MAX_INPUT_A) {
    return notApplicable(standard, `The input current is ${inputCurrent.toPrecision(3)} A; IEC 61000-3-2 covers equipment up to 16 A per phase (IEC 61000-3-12 covers larger equipment).`);
  }
  const reason = notJudgeableReason(input.analysis);
  if (reason) return notApplicable(standard, reason);
  const power = req.activePower ?? input.power?.activePower ?? null;
  const notes = [INDICATIVE_NOTE];
  let limitOf: OrderLimit;
  if (req.class === 'A') {
    limitOf = (h) => nullable(classALimitAmps(h), (amps) => ({ amps }));
  } else if (req.class === 'D') {
    if (power === null) return notApplicable(standard, 'Class D limits are per watt of active input power: give activePower, or capture a voltage channel with the current so the Power figures give it.');
    if (power <= CLASS_D_POWER_W.above) return notApplicable(standard, `The active input power is ${power.toPrecision(3)} W; Class D sets no limits at ${CLASS_D_POWER_W.above} W or less.`);
    if (power > CLASS_D_POWER_W.upTo) return notApplicable(standard, `The active input power is ${power.toPrecision(3)} W; Class D covers equipment up to ${CLASS_D_POWER_W.upTo} W (Class A applies above).`);
    limitOf = (h) => nullable(classDLimitAmps(h, power), (amps) => ({ amps }));
    notes.push(`Limits for an active input power of ${power.toPrecision(4)} W${req.activePower ? ' (as given)' : ' (from the Power figures)'}, capped at the Class A values.`);
  } else {
    const lambda = req.powerFactor ?? input.power?.powerFactor ?? null;
    if (lambda === null) return notApplicable(standard, 'The Class C limit of the 3rd harmonic is 30 % × λ, the circuit power factor: give powerFactor, or capture a voltage channel with the current so the Power figures give it.');
    if (power !== null && power <= CLASS_C_ABOVE_W) return notApplicable(standard, `The active input power is ${power.toPrecision(3)} W; lighting of ${CLASS_C_ABOVE_W} W or less is judged by other criteria, not included here.`);
    limitOf = (h) => nullable(classCLimitPercent(h, lambda), (percent) => ({ percent }));
    notes.push(`3rd-harmonic limit for a circuit power factor λ = ${lambda.toFixed(3)}${req.powerFactor ? ' (as given)' : ' (from the Power figures)'}.`);
    if (power === null) notes.push(`Assumes lighting of more than ${CLASS_C_ABOVE_W} W: no active power was given or measured.`);
  }
  const measured = harmonicsByOrder(input.analysis, si.factor);
  const i1 = measured.get(1)!;
  const floor = Math.max(IEC61000_3_2_DISREGARD.amps, (IEC61000_3_2_DISREGARD.percentOfInput / 100) * inputCurrent);
  const disregarded: number[] = [];
  const rows: ComplianceRow[] = [];
  for (let h = 2; h <= 40; h++) {
    const limit = limitOf(h);
    if (!limit) continue;
    const m = measured.get(h);
    const row: ComplianceRow = {
      quantity: 'harmonic',
      order: h,
      measured: m ?? null,
      measuredPercent: m === undefined ? null : (100 * m) / i1,
      limit: 'amps' in limit ? limit.amps : null,
      limitPercent: 'percent' in limit ? limit.percent : null,
      pass: null,
    };
    if (m !== undefined) row.pass = 'amps' in limit ? m <= limit.amps : row.measuredPercent! <= limit.percent;
    // Below the threshold an order is not judged: it matters only where it would otherwise fail.
    if (row.pass === false && m! < floor) {
      row.pass = null;
      disregarded.push(h);
    }
    rows.push(row);
  }
  if (disregarded.length) notes.push(`Order${disregarded.length > 1 ? 's' : ''} ${disregarded.join(', ')} would exceed the limit but ${disregarded.length > 1 ? 'are' : 'is'} below ${(floor * 1000).toPrecision(3)} mA (5 mA or 0.6 % of the input current), which the standard disregards (from memory): not judged.`);
  notes.push('The standard averages 1.5 s-smoothed values over an observation period and allows brief values up to 150 % of the limits; one capture shows neither.');
  notes.push('The limits are set for 220–240 V line-to-neutral supplies.');
  const missing = unmeasuredNote(measured, 40);
  if (missing) notes.push(missing);
  return { verdict: verdictOf(rows), standard, reason: null, basis: { of: 'fundamental', value: i1, unit: 'A' }, rows, notes };
}

const nullable = <T, R>(v: T | null, f: (v: T) => R): R | null => (v === null ? null : f(v));
