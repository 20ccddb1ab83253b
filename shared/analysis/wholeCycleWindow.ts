/** Fraction of a cycle by which a record may fall short and still count as that many whole cycles. */
const SNAP_CYCLES = 0.02;

export interface SampleWindow {
  startIndex: number;
  sampleCount: number;
  cycles: number | null;
}

/**
 * The largest whole number of fundamental cycles in a record of `length` samples, from its first
 * sample. A partial cycle biases RMS by up to |sin 2πc|/(4πc) and the mean by up to peak/(πc), so
 * figures are taken over whole cycles only. A record within 2 % of a cycle of a whole count (the
 * estimate's own error) is taken as that count.
 */
export function wholeCycleWindow(length: number, sampleRate: number, frequency: number | null): SampleWindow {
  if (frequency === null || !(frequency > 0)) return { startIndex: 0, sampleCount: length, cycles: null };
  const samplesPerCycle = sampleRate / frequency;
  const available = length / samplesPerCycle;
  const cycles = Math.floor(available + SNAP_CYCLES);
  if (cycles < 1) return { startIndex: 0, sampleCount: length, cycles: null };
  const wanted = Math.round(cycles * samplesPerCycle);
  // Within the snap tolerance the whole record is the window: the shortfall is the estimate's error.
  const sampleCount = wanted >= length - SNAP_CYCLES * samplesPerCycle ? length : wanted;
  return { startIndex: 0, sampleCount, cycles };
}
