import type { Harmonic, MeterReading, MeterReadings } from '../schemas/analysis';
import type { MeterFlag, MeterPrediction, MeterProfile } from '../schemas/meterProfile';
import type { TimeDomainFigures } from './timeDomainFigures';

/** Form factor of a sine, π/(2√2): the scale a sine-calibrated average-responding meter applies. */
export const SINE_FORM_FACTOR = Math.PI / (2 * Math.SQRT2);

/** AC functions of handheld meters are usually specified only above about 5 % of range (common practice). */
const SPECIFIED_FROM_FRACTION_OF_RANGE = 0.05;

function percentError(reading: number, truth: number): number | null {
  return truth > 0 ? 100 * (reading / truth - 1) : null;
}

function reading(value: number, reference: 'acRms' | 'rms', f: TimeDomainFigures): MeterReading {
  return {
    reading: value,
    reference,
    errorPercent: percentError(value, reference === 'acRms' ? f.acRms : f.rms),
    errorVsTotalPercent: percentError(value, f.rms),
  };
}

/** What four idealised meters (infinite bandwidth, no crest-factor limit) would show for these figures. */
export function meterReadings(f: TimeDomainFigures): MeterReadings {
  return {
    averageResponding: reading(SINE_FORM_FACTOR * f.acRectifiedAverage, 'acRms', f),
    trueRmsAc: reading(f.acRms, 'acRms', f),
    trueRmsAcDc: reading(f.rms, 'rms', f),
    peakResponding: reading(f.acPeak / Math.SQRT2, 'acRms', f),
  };
}

/** What the meter model needs of an analysed channel. */
export interface MeterModelInput {
  figures: TimeDomainFigures;
  frequency: number | null;
  harmonics: Harmonic[];
}

const RECONSTRUCTION_POINTS = 4096;

/** Gain and phase of a first-order low-pass with −3 dB at `cutoff`. */
function lowPass(f: number, cutoff: number): { gain: number; phase: number } {
  const r = f / cutoff;
  return { gain: 1 / Math.sqrt(1 + r * r), phase: -Math.atan(r) };
}

/**
 * One period of the AC part rebuilt from its harmonics after the meter's low-pass: what a band-limited
 * rectifier or peak detector actually sees.
 */
function filteredPeriod(harmonics: Harmonic[], cutoff: number): Float64Array {
  const y = new Float64Array(RECONSTRUCTION_POINTS);
  for (const h of harmonics) {
    const { gain, phase } = lowPass(h.frequency, cutoff);
    const amplitude = Math.SQRT2 * h.rms * gain;
    const phi = (h.phaseDeg * Math.PI) / 180 + phase;
    for (let n = 0; n < RECONSTRUCTION_POINTS; n++) {
      y[n] += amplitude * Math.cos((2 * Math.PI * h.order * n) / RECONSTRUCTION_POINTS + phi);
    }
  }
  return y;
}

/** The idealised reading of each meter type, before range and accuracy. */
function idealReading(profile: MeterProfile, input: MeterModelInput, flags: MeterFlag[]): number {
  const { figures: f, harmonics } = input;
  const cutoff = profile.bandwidthHz ?? null;
  const dcSq = profile.type === 'trueRmsAcDc' ? f.mean ** 2 : 0;
  if (cutoff === null) {
    if (profile.type === 'averageResponding') return SINE_FORM_FACTOR * f.acRectifiedAverage;
    if (profile.type === 'peakResponding') return f.acPeak / Math.SQRT2;
    return Math.sqrt(f.acRms ** 2 + dcSq);
  }
  if (harmonics.length === 0) {
    flags.push({ code: 'bandwidthNotModelled', message: 'The signal is not periodic, so the bandwidth limit could not be applied; the reading assumes unlimited bandwidth.' });
    return idealReading({ ...profile, bandwidthHz: null }, input, []);
  }
  if (profile.type === 'trueRmsAc' || profile.type === 'trueRmsAcDc') {
    let passedSq = 0;
    let harmonicSq = 0;
    for (const h of harmonics) {
      harmonicSq += h.rms ** 2;
      passedSq += (h.rms * lowPass(h.frequency, cutoff).gain) ** 2;
    }
    // Content between and above the listed harmonics is taken as lying just above the highest one.
    const top = harmonics[harmonics.length - 1];
    const residualSq = Math.max(0, f.acRms ** 2 - harmonicSq);
    const residualGain = lowPass(top.frequency * (1 + 1 / top.order), cutoff).gain;
    return Math.sqrt(passedSq + residualSq * residualGain ** 2 + dcSq);
  }
  const y = filteredPeriod(harmonics, cutoff);
  if (profile.type === 'averageResponding') {
    let s = 0;
    for (const v of y) s += Math.abs(v);
    return (SINE_FORM_FACTOR * s) / y.length;
  }
  let peak = 0;
  for (const v of y) peak = Math.max(peak, Math.abs(v));
  return peak / Math.SQRT2;
}

/**
 * Predicts what a real meter would display for an analysed channel: its type's response, a first-order
 * bandwidth limit, the crest-factor headroom of its converter, and its accuracy spec on the range in
 * use. Returns the reading, its uncertainty interval, and flags for conditions outside the spec.
 */
export function meterModel(profile: MeterProfile, input: MeterModelInput): MeterPrediction {
  const flags: MeterFlag[] = [];
  const { figures: f, frequency } = input;
  const acDc = profile.type === 'trueRmsAcDc';
  const value = idealReading(profile, input, flags);
  const trueValue = acDc ? f.rms : f.acRms;

  if (!acDc && Math.abs(f.mean) > 0.05 * f.rms) {
    flags.push({ code: 'dcBlocked', message: `The meter blocks a DC part of ${fmt(f.mean)}; it shows the AC part only.` });
  }
  const cutoff = profile.bandwidthHz ?? null;
  if (cutoff !== null && frequency !== null && frequency > cutoff) {
    flags.push({ code: 'fundamentalAboveBandwidth', message: `The fundamental (${fmt(frequency)} Hz) is above the meter's bandwidth (${fmt(cutoff)} Hz).` });
  }
  const crest = acDc ? f.crestFactor : f.acRms > 0 ? f.acPeak / f.acRms : null;
  const signalPeak = acDc ? f.peak : f.acPeak;
  const range = profile.range ?? null;
  if (profile.crestFactorLimit && crest !== null) {
    // The limit is the converter's peak headroom: CF at full scale, proportionally more at lower readings.
    const allowed = range && value > 0 ? profile.crestFactorLimit * Math.max(1, range.fullScale / value) : profile.crestFactorLimit;
    if (crest > allowed) {
      flags.push({ code: 'crestFactorExceeded', message: `Crest factor ${crest.toFixed(2)} exceeds the ${allowed.toFixed(2)} the meter handles at this reading (peak ${fmt(signalPeak)}).` });
    }
  }
  if (range) {
    if (value > range.fullScale) flags.push({ code: 'overRange', message: `The reading exceeds the range's full scale of ${fmt(range.fullScale)}.` });
    else if (value < SPECIFIED_FROM_FRACTION_OF_RANGE * range.fullScale) {
      flags.push({ code: 'belowSpecifiedRange', message: 'The reading is below 5 % of the range, where AC accuracy is usually not specified.' });
    }
  }
  const spec = profile.accuracy ?? null;
  const resolution = range ? range.fullScale / range.displayCounts : 0;
  const uncertainty = spec ? (spec.percentOfReading / 100) * value + spec.counts * resolution : 0;
  const low = value - uncertainty;
  const high = value + uncertainty;
  return {
    reading: value,
    low,
    high,
    trueValue,
    errorPercent: percentError(value, trueValue),
    trueValueInsideInterval: trueValue >= low - 1e-12 * Math.abs(trueValue) && trueValue <= high + 1e-12 * Math.abs(trueValue),
    flags,
  };
}

function fmt(v: number): string {
  return Number(v.toPrecision(4)).toString();
}

/** The meter model's input from a stored analysis (its window's figures, frequency and harmonics). */
export function meterInputOf(a: {
  mean: number; rms: number; acRms: number; rectifiedAverage: number; acRectifiedAverage: number; peak: number; min: number; max: number;
  peakToPeak: number; crestFactor: number | null; formFactor: number | null; frequency: number | null; harmonics: Harmonic[];
}): MeterModelInput {
  return {
    figures: {
      mean: a.mean, rms: a.rms, acRms: a.acRms, rectifiedAverage: a.rectifiedAverage, acRectifiedAverage: a.acRectifiedAverage, peak: a.peak,
      min: a.min, max: a.max, peakToPeak: a.peakToPeak, acPeak: Math.max(a.max - a.mean, a.mean - a.min), crestFactor: a.crestFactor, formFactor: a.formFactor,
    },
    frequency: a.frequency,
    harmonics: a.harmonics,
  };
}
