/** Units Crestline can turn into volts or amperes, with the factor to multiply by. */
const SI: Record<string, { quantity: 'voltage' | 'current'; factor: number }> = {
  V: { quantity: 'voltage', factor: 1 },
  mV: { quantity: 'voltage', factor: 1e-3 },
  kV: { quantity: 'voltage', factor: 1e3 },
  A: { quantity: 'current', factor: 1 },
  mA: { quantity: 'current', factor: 1e-3 },
  kA: { quantity: 'current', factor: 1e3 },
};

/** Whether a channel unit is a voltage or a current, and the factor from it to V or A; null for anything else. */
export function siQuantityOf(unit: string): { quantity: 'voltage' | 'current'; factor: number } | null {
  return SI[unit.trim()] ?? null;
}
