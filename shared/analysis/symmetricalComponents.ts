import { abs, add, mul, polar, scale, type Phasor } from './phasor';

/** The operator a = 1∠120°. */
const A = polar(1, 120);
const A2 = polar(1, 240);

export interface SequenceComponents {
  zero: Phasor;
  positive: Phasor;
  negative: Phasor;
}

/**
 * Fortescue's symmetrical components of three phasors taken in the order of the phase sequence
 * (1, 2, 3): V0 = (V1 + V2 + V3)/3, V+ = (V1 + a·V2 + a²·V3)/3, V− = (V1 + a²·V2 + a·V3)/3 with
 * a = 1∠120°. Components are in the phasors' unit (RMS phasors in, RMS phasors out).
 */
export function symmetricalComponents(p1: Phasor, p2: Phasor, p3: Phasor): SequenceComponents {
  return {
    zero: scale(add(add(p1, p2), p3), 1 / 3),
    positive: scale(add(add(p1, mul(A, p2)), mul(A2, p3)), 1 / 3),
    negative: scale(add(add(p1, mul(A2, p2)), mul(A, p3)), 1 / 3),
  };
}

/**
 * Unbalance after IEC 61000-4-30 and IEC 61000-2-12: u2 = |V−|/|V+| × 100 % and u0 = |V0|/|V+| × 100 %.
 * Null when there is no positive sequence to compare with: rounding leaves about 1e-14 of one in a pure
 * negative- or zero-sequence set, and a ratio to that would read 10¹⁶ %.
 */
export function sequenceUnbalance(c: SequenceComponents): { negativePercent: number | null; zeroPercent: number | null } {
  const v1 = abs(c.positive);
  if (!(v1 > 1e-9 * Math.max(abs(c.negative), abs(c.zero)))) return { negativePercent: null, zeroPercent: null };
  return { negativePercent: (100 * abs(c.negative)) / v1, zeroPercent: (100 * abs(c.zero)) / v1 };
}
