import type { MeterAdvice } from '../../schemas/meterSimulation';

/** What the advice needs to know of a finished simulation. */
export interface AdviceInput {
  steadyStateReading: number;
  ripplePeakToPeak: number;
  /** The part of the ripple left after averaging over each fundamental period. */
  wanderPeakToPeak: number;
  settlingTimeS: number | null;
  displayRateHz: number;
  fundamentalHz: number | null;
  rippleOrder: 1 | 2;
  clippedFraction: number;
  clipLevel: number | null;
  /** Full scale of a fixed range, or null when auto-ranging. */
  fullScale: number | null;
  start: 'connected' | 'settled';
  repeated: boolean;
  simulatedS: number;
  unit: string;
}

/** A reading swinging by more than ±1 % is not a steady reading (the same band as the settling time). */
const STEADY_SWING = 0.02;

const round2 = (v: number) => Number(v.toPrecision(2));
/** Up to two significant figures, rounded up: "wait" must never be too short. */
const ceil2 = (v: number) => {
  if (v <= 0) return 0;
  const scale = 10 ** (Math.floor(Math.log10(v)) - 1);
  return Number((Math.ceil(v / scale - 1e-9) * scale).toPrecision(2));
};

/**
 * One sentence on what the user should do with this meter on this waveform, in order of what matters:
 * clipping or over-range, then a swing too large to read (slow wander of the waveform itself, or ripple
 * at its frequency), then a record too short, then how long to wait. The frequency below which the
 * meter cannot read steadily scales the ripple as 1/f (one pole, a peak detector's droop) or 1/f² (two
 * poles), as it does once ωτ ≫ 1.
 */
export function meterTimeAdvice(a: AdviceInput): MeterAdvice {
  const final = Math.abs(a.steadyStateReading);
  if (a.clippedFraction > 0 && a.clipLevel !== null) {
    return { kind: 'clipped', sentence: `Choose a higher range: the input exceeds this meter's crest-factor headroom (±${round2(a.clipLevel)} ${a.unit}) and its peaks are cut, so the reading is low.` };
  }
  if (a.fullScale !== null && final > a.fullScale) {
    return { kind: 'overRange', sentence: `Choose a higher range: the reading (${round2(final)} ${a.unit}) is beyond this range's full scale of ${round2(a.fullScale)} ${a.unit}, so the display shows over-range.` };
  }
  if (!(final > 0)) return { kind: 'noSignal', sentence: 'The meter sees no signal on this channel: its reading stays at zero.' };
  const swing = a.ripplePeakToPeak / final;
  const wander = a.fundamentalHz === null ? swing : a.wanderPeakToPeak / final;
  const plusMinus = (s: number) => `±${round2((100 * s) / 2)} %`;
  if (wander > STEADY_SWING) {
    return { kind: 'unsteady', sentence: `This meter cannot give a steady reading of this waveform: it wanders by ${plusMinus(wander)} because the waveform itself changes more slowly than the meter averages (a hunting motor, a cycling load); take the mean of several readings.` };
  }
  if (swing > STEADY_SWING) {
    const lowest = a.fundamentalHz! * (swing / STEADY_SWING) ** (1 / a.rippleOrder);
    return { kind: 'unsteady', sentence: `This meter cannot give a steady reading below about ${ceil2(lowest)} Hz: here its reading swings by ${plusMinus(swing)}, so read a slower-averaging meter or take the mean of several readings.` };
  }
  if (a.settlingTimeS === null) {
    return a.repeated
      ? { kind: 'notSettled', sentence: `The reading has not settled within ${round2(a.simulatedS)} s of looping this span; look at the trend before you trust any reading.` }
      : { kind: 'notSettled', sentence: 'This span is too short for the meter to settle: loop it (repeat) to see how long to wait.' };
  }
  // The display shows a settled value from its first update after the reading settled.
  const readable = Math.ceil(a.settlingTimeS * a.displayRateHz - 1e-9) / a.displayRateHz;
  return a.start === 'connected'
    ? { kind: 'wait', sentence: `Wait ${ceil2(readable)} s after connecting: from then on every reading is within 1 % of the final one.` }
    : { kind: 'wait', sentence: `From ${ceil2(readable)} s into this span on, every reading is within 1 % of the final one.` };
}
