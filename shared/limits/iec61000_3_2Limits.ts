/**
 * IEC 61000-3-2 Ed. 5.0 (2018) + Amd 1 (2020), Table 1: Class A, maximum permissible harmonic current
 * in A (RMS) for orders 2…40; unchanged in substance across editions (secondary texts; not checked
 * against the purchased standard). Orders not listed have no limit.
 */
export const IEC61000_3_2_CLASS_A: Readonly<Record<number, number>> = { 2: 1.08, 3: 2.3, 4: 0.43, 5: 1.14, 6: 0.3, 7: 0.77, 9: 0.4, 11: 0.33, 13: 0.21 };

/** Class A limit of `order` in A: the table, then 0.15·15/h for odd 15…39 and 0.23·8/h for even 8…40. */
export function classALimitAmps(order: number): number | null {
  if (!Number.isInteger(order) || order < 2 || order > 40) return null;
  if (IEC61000_3_2_CLASS_A[order] !== undefined) return IEC61000_3_2_CLASS_A[order];
  if (order % 2 === 1) return order >= 15 ? (0.15 * 15) / order : null;
  return order >= 8 ? (0.23 * 8) / order : null;
}

/**
 * IEC 61000-3-2 Ed. 5.0 + Amd 1, Table 3: Class D (personal computers, monitors, television receivers,
 * 75 W < P ≤ 600 W), in mA per W of the active input power, odd orders only; each value is also capped
 * at the Class A limit. Values from memory (our domain notes mark them "values M"): verify them.
 */
export const IEC61000_3_2_CLASS_D: Readonly<Record<number, number>> = { 3: 3.4, 5: 1.9, 7: 1.0, 9: 0.5, 11: 0.35 };

/** The Class D power range in W: no limits at or below 75 W; above 600 W Class D does not apply. */
export const CLASS_D_POWER_W = { above: 75, upTo: 600 } as const;

/** Class D limit of `order` in mA/W: the table, then 3.85/h for odd 13…39; null for even and other orders. */
export function classDLimitMilliampsPerWatt(order: number): number | null {
  if (!Number.isInteger(order) || order < 3 || order > 39 || order % 2 === 0) return null;
  return IEC61000_3_2_CLASS_D[order] ?? 3.85 / order;
}

/** Class D limit of `order` in A for an active input power in W: the per-watt value, capped at Class A. */
export function classDLimitAmps(order: number, activePowerW: number): number | null {
  const perWatt = classDLimitMilliampsPerWatt(order);
  if (perWatt === null) return null;
  const capA = classALimitAmps(order);
  const amps = (perWatt * activePowerW) / 1000;
  return capA === null ? amps : Math.min(amps, capA);
}

/**
 * IEC 61000-3-2 Ed. 5.0 + Amd 1, Table 2: Class C (lighting equipment above 25 W), in % of the
 * fundamental input current; the 3rd harmonic's limit is 30 % × λ, the circuit power factor. Values
 * from memory (our domain notes mark them "values M"): verify them.
 */
export function classCLimitPercent(order: number, powerFactor: number): number | null {
  if (!Number.isInteger(order) || order < 2 || order > 39) return null;
  if (order === 2) return 2;
  if (order === 3) return 30 * powerFactor;
  if (order % 2 === 0) return null;
  if (order === 5) return 10;
  if (order === 7) return 7;
  if (order === 9) return 5;
  return 3;
}

/** Class C applies to lighting above this input power, in W. */
export const CLASS_C_ABOVE_W = 25;

/** Equipment with an input current up to this (A per phase) is in the standard's scope. */
export const IEC61000_3_2_MAX_INPUT_A = 16;

/**
 * Harmonic currents below 0.6 % of the input current or below 5 mA are disregarded (IEC 61000-3-2,
 * general conditions; from memory).
 */
export const IEC61000_3_2_DISREGARD = { percentOfInput: 0.6, amps: 0.005 } as const;
