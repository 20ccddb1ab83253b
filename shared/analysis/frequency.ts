import type { FrequencyDetail } from '../schemas/analysis';
import { decimateByAverage } from './decimate';
import { dtftAt } from './dft';
import type { Samples } from './samples';

export interface FrequencyEstimate {
  /** Fundamental frequency in Hz, or null when the record is aperiodic (DC, noise, too short). */
  hz: number | null;
  detail: FrequencyDetail | null;
}

/** Above this spread of individual periods the crossings are not of one periodic signal. */
const MAX_PERIOD_SPREAD = 0.05;
const HYSTERESIS_OF_AC_RMS = 0.1;

export interface Crossings {
  /** Crossing positions in samples (fractional, by linear interpolation). */
  times: number[];
  /** Standard deviation of the periods between crossings over their mean (Infinity below 2 crossings). */
  spread: number;
}

/**
 * Rising zero crossings of `x − mean`, in samples (fractional), with hysteresis: the detector arms below
 * −h and fires at the first sample at or above +h, so noise and harmonic wiggles near zero cannot
 * fire it twice. The thresholds follow each polarity's own excursion, so a narrow pulse train (tiny
 * negative swing, tall positive one) still arms.
 */
export function risingZeroCrossings(x: ArrayLike<number>, mean: number, acRms: number, acMin: number, acMax: number): Crossings {
  const h = HYSTERESIS_OF_AC_RMS * acRms;
  const low = -Math.min(h, 0.5 * -acMin);
  const high = Math.min(h, 0.5 * acMax);
  const times: number[] = [];
  let armed = false;
  for (let i = 0; i < x.length; i++) {
    const v = x[i] - mean;
    if (v < low) armed = true;
    else if (armed && v >= high) {
      armed = false;
      let j = i;
      while (j > 0 && x[j - 1] - mean >= 0) j--;
      if (j === 0) continue;
      const a = x[j - 1] - mean;
      const b = x[j] - mean;
      times.push(j - 1 + -a / (b - a));
    }
  }
  let spread = Infinity;
  if (times.length >= 3) {
    const periods = times.slice(1).map((t, i) => t - times[i]);
    const m = periods.reduce((s, p) => s + p, 0) / periods.length;
    const variance = periods.reduce((s, p) => s + (p - m) ** 2, 0) / periods.length;
    spread = Math.sqrt(variance) / m;
  } else if (times.length === 2) {
    spread = 0;
  }
  return { times, spread };
}

/** Centred moving average; zero phase, so crossing times do not move. */
function movingAverage(x: Samples, width: number): Float64Array {
  const out = new Float64Array(x.length);
  const half = Math.floor(width / 2);
  let acc = 0;
  let lo = 0;
  let hi = -1;
  for (let i = 0; i < x.length; i++) {
    const wantLo = Math.max(0, i - half);
    const wantHi = Math.min(x.length - 1, i + half);
    while (hi < wantHi) acc += x[++hi];
    while (lo < wantLo) acc -= x[lo++];
    out[i] = acc / (hi - lo + 1);
  }
  return out;
}

/** Least-squares period through crossing times: uses every crossing, so jitter averages out. */
function fittedPeriod(times: number[]): number {
  const n = times.length;
  const meanI = (n - 1) / 2;
  const meanT = times.reduce((s, t) => s + t, 0) / n;
  let num = 0;
  let den = 0;
  for (let i = 0; i < n; i++) {
    num += (i - meanI) * (times[i] - meanT);
    den += (i - meanI) ** 2;
  }
  return num / den;
}

/**
 * Refines a frequency by maximising the Hann-windowed spectrum magnitude near it (golden-section search
 * over ±half a bin of the record). Noise moves single crossings but hardly the spectral peak.
 */
function spectralPeak(x: Samples, mean: number, count: number, guessCyclesPerSample: number): number {
  const halfBin = 0.5 / count;
  let a = guessCyclesPerSample - halfBin;
  let b = guessCyclesPerSample + halfBin;
  const mag = (f: number) => {
    const { re, im } = dtftAt(x, 0, count, f, true, mean);
    return re * re + im * im;
  };
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = mag(c);
  let fd = mag(d);
  for (let i = 0; i < 24; i++) {
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = mag(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = mag(d);
    }
  }
  return (a + b) / 2;
}

/** Records longer than this are averaged down to about this length for the smoothed and spectral steps. */
const DECIMATED_LENGTH = 65536;
/** Smoothing widths tried, as fractions of the record: a PWM carrier or switching noise averages out. */
const SMOOTHING_DIVISORS = [1000, 200, 50];
/** Spread above which the spectrum refines a crossing estimate (below it, the crossings are better). */
const REFINE_ABOVE_SPREAD = 0.001;
/** A candidate fundamental must carry this share of the AC RMS to be preferred to a higher one. */
const MIN_FUNDAMENTAL_SHARE = 0.1;

interface Candidate extends Crossings {
  method: FrequencyDetail['method'];
  period: number;
}

/** Periods agreeing this closely are one fundamental seen by two detectors. */
const SAME_PERIOD = 0.02;

/**
 * The longest period among the candidates and their 2× and 3× multiples (a waveform can cross zero
 * rising more than once per cycle) whose component carries a real share of the AC RMS. Among
 * candidates of that same period, the least smoothed one is kept, its crossings being the sharpest.
 */
function pickFundamental(coarse: Samples, factor: number, found: Candidate[], mean: number, acRms: number): Candidate | null {
  const hypotheses = found.flatMap((c) => [1, 2, 3].map((m) => ({ ...c, period: c.period * m, times: m === 1 ? c.times : c.times.filter((_, i) => i % m === 0) })));
  hypotheses.sort((a, b) => b.period - a.period);
  const strong = hypotheses.find(
    (h) => h.times.length >= 2 && coarse.length * factor >= h.period && componentRms(coarse, mean, h.period / factor) >= MIN_FUNDAMENTAL_SHARE * acRms,
  );
  if (!strong) return null;
  return found.find((c) => Math.abs(c.period / strong.period - 1) < SAME_PERIOD) ?? strong;
}

function candidateFrom(x: ArrayLike<number>, mean: number, method: FrequencyDetail['method'], minCrossings: number): Candidate | null {
  let lo = Infinity;
  let hi = -Infinity;
  let sq = 0;
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
    sq += (v - mean) ** 2;
  }
  const found = risingZeroCrossings(x, mean, Math.sqrt(sq / x.length), lo - mean, hi - mean);
  if (found.times.length < minCrossings || found.spread > MAX_PERIOD_SPREAD) return null;
  return { ...found, method, period: fittedPeriod(found.times) };
}

/**
 * RMS of the component with the given period, over the whole number of such periods in the record.
 * Over whole periods every other harmonic of a true fundamental is orthogonal to it, so a wrong
 * (sub-multiple) hypothesis reads near zero however short the record.
 */
function componentRms(x: Samples, mean: number, period: number): number {
  const count = Math.round(Math.floor(x.length / period) * period);
  if (count < 2) return 0;
  const { re, im } = dtftAt(x, 0, count, 1 / period, false, mean);
  return (Math.SQRT2 * Math.hypot(re, im)) / count;
}

/**
 * The fundamental frequency of a record: rising zero crossings of the AC part with hysteresis, on the
 * record and on smoothed copies of it. The lowest regular crossing rate whose component carries a
 * real share of the AC RMS wins, so a drive's PWM carrier does not pass for its output frequency.
 * Irregular crossings (noise) are refined on the spectrum, which averages jitter over the whole record.
 *
 * @param x samples
 * @param sampleRate in samples per second
 * @param figures time-domain figures of the whole record (the caller has them already)
 */
export function estimateFrequency(
  x: Samples,
  sampleRate: number,
  figures: { mean: number; acRms: number; min: number; max: number },
): FrequencyEstimate {
  const { mean, acRms, min, max } = figures;
  const scale = Math.max(Math.abs(mean), Math.abs(max), Math.abs(min));
  if (!(acRms > 1e-9 * scale)) return { hz: null, detail: null };

  // Long records are averaged down for the smoothed detectors and the spectral checks: they look at
  // the fundamental only, which a short average passes with a known, tiny loss.
  const factor = Math.max(1, Math.floor(x.length / DECIMATED_LENGTH));
  const coarse = factor > 1 ? decimateByAverage(x, factor) : x;
  const toFine = (c: Candidate): Candidate => ({ ...c, period: c.period * factor, times: c.times.map((t) => (t + 0.5) * factor - 0.5) });

  const found: Candidate[] = [];
  const raw = candidateFrom(x, mean, 'zeroCrossing', 2);
  if (raw) found.push(raw);
  for (const divisor of SMOOTHING_DIVISORS) {
    const width = Math.floor(coarse.length / divisor);
    if (width < 3) continue;
    // Four crossings at least: smoothed noise can line up two or three by chance.
    const c = candidateFrom(movingAverage(coarse, width), mean, 'zeroCrossingSmoothed', 4);
    if (c) found.push(toFine(c));
  }
  const chosen = pickFundamental(coarse, factor, found, mean, acRms);
  if (!chosen) return { hz: null, detail: null };

  let cyclesPerSample = 1 / chosen.period;
  let correction = 0;
  const cycles = x.length * cyclesPerSample;
  if ((chosen.spread > REFINE_ABOVE_SPREAD || chosen.method !== 'zeroCrossing') && cycles >= 4) {
    const refined = spectralPeak(coarse, mean, coarse.length, cyclesPerSample * factor) / factor;
    correction = (refined - cyclesPerSample) / cyclesPerSample;
    cyclesPerSample = refined;
  }
  const periods = chosen.times.length - 1;
  const confidence: FrequencyDetail['confidence'] =
    chosen.spread < 0.005 && periods >= 3 ? 'high' : chosen.spread < 0.02 && periods >= 2 ? 'medium' : 'low';
  return {
    hz: cyclesPerSample * sampleRate,
    detail: {
      method: chosen.method,
      crossings: chosen.times.length,
      periodSpreadPercent: chosen.spread * 100,
      spectralCorrectionPercent: correction * 100,
      confidence,
    },
  };
}
