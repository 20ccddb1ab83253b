import { z } from 'zod';

/** Channel units Crestline reads as a voltage. */
export const VoltageUnit = z.enum(['V', 'kV']);
export type VoltageUnit = z.infer<typeof VoltageUnit>;

/** Channel units Crestline reads as a current. */
export const CurrentUnit = z.enum(['A', 'mA']);
export type CurrentUnit = z.infer<typeof CurrentUnit>;

/** Factor from a channel unit to its SI base unit (kV → V, mA → A). */
export const TO_BASE_UNIT: Record<VoltageUnit | CurrentUnit, number> = { V: 1, kV: 1000, A: 1, mA: 0.001 };

export const isVoltageUnit = (unit: string): unit is VoltageUnit => VoltageUnit.safeParse(unit).success;
export const isCurrentUnit = (unit: string): unit is CurrentUnit => CurrentUnit.safeParse(unit).success;
