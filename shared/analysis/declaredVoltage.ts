/** Nominal low-voltage supply voltages (line-to-neutral and line-to-line) in use around the world, in V (common practice, no source). */
export const NOMINAL_VOLTAGES = [100, 110, 115, 120, 127, 200, 208, 220, 230, 240, 254, 277, 347, 380, 400, 415, 440, 480, 600, 690];

/** A measured RMS further than this share from every nominal suggests none. */
const SUGGEST_WITHIN = 0.15;

/**
 * The nominal voltage nearest a measured RMS (in V), as a suggestion for the declared voltage; null
 * when none is within 15 % (a 24 V control supply, a drive's output).
 */
export function suggestDeclaredVoltage(rms: number): number | null {
  if (!(rms > 0)) return null;
  const best = NOMINAL_VOLTAGES.reduce((a, b) => (Math.abs(Math.log(b / rms)) < Math.abs(Math.log(a / rms)) ? b : a));
  return Math.abs(best / rms - 1) <= SUGGEST_WITHIN ? best : null;
}

/**
 * The declared voltage that applies to one channel: a declared supply voltage is line-to-neutral or
 * line-to-line, and a channel may be either, so the nearest of U, U·√3 and U/√3 to its RMS is taken.
 */
export function declaredForChannel(declared: number, channelRms: number): number {
  const candidates = [declared, declared * Math.sqrt(3), declared / Math.sqrt(3)];
  return candidates.reduce((a, b) => (Math.abs(Math.log(b / channelRms)) < Math.abs(Math.log(a / channelRms)) ? b : a));
}
