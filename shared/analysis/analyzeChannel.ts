import type { ChannelAnalysis } from '../schemas/analysis';
import { findClipping, type ClippingFinding } from './clipping';
import { estimateFrequency } from './frequency';
import { harmonics } from './harmonics';
import { iecHarmonicGroups, mainsSystemOf } from './iec61000_4_7';
import { meterReadings } from './meters';
import type { Samples } from './samples';
import { timeDomainFigures } from './timeDomainFigures';
import { analysisWarnings } from './warnings';
import { wholeCycleWindow } from './wholeCycleWindow';

export interface AnalysisSettings {
  /** Highest harmonic order reported (IEC 61000-4-7 and IEEE 519 go to 50). */
  maxHarmonicOrder?: number;
  /** IEC 61000-4-7 groups: a mains system, 'auto' (when the fundamental is within 10 % of 50 or 60 Hz), or off. */
  iec?: 50 | 60 | 'auto' | 'off';
  /** Time of the first sample, in seconds (pre-trigger records start negative). */
  t0?: number;
  /**
   * The record's clipping, when the caller has already looked for it (findClipping over all of `x`
   * with its extremes): the ingest shares one search between these warnings and the anomaly finder.
   */
  clipping?: ClippingFinding[];
}

/**
 * Everything Crestline reports for one channel: the whole-cycle window, the time-domain figures over it,
 * the fundamental, harmonics and THD, what each kind of meter would show, and warnings.
 *
 * @param x samples in the channel's unit
 * @param sampleRate samples per second
 */
export function analyzeChannel(x: Samples, sampleRate: number, settings: AnalysisSettings = {}): ChannelAnalysis {
  if (x.length < 2) throw new RangeError(`analyzeChannel: need at least 2 samples, got ${x.length}`);
  if (!(sampleRate > 0)) throw new RangeError(`analyzeChannel: sample rate must be positive, got ${sampleRate}`);
  const maxOrder = settings.maxHarmonicOrder ?? 50;
  const t0 = settings.t0 ?? 0;

  const whole = timeDomainFigures(x);
  const freq = estimateFrequency(x, sampleRate, whole);
  const win = wholeCycleWindow(x.length, sampleRate, freq.hz);
  const f = win.sampleCount === x.length ? whole : timeDomainFigures(x, win.startIndex, win.sampleCount);
  const harm = win.cycles !== null ? harmonics(x, win.startIndex, win.sampleCount, win.cycles, sampleRate, maxOrder) : null;

  const iecSetting = settings.iec ?? 'auto';
  const mains = iecSetting === 'off' ? null : iecSetting === 'auto' ? mainsSystemOf(freq.hz) : iecSetting;
  const iec = mains !== null && freq.hz !== null ? iecHarmonicGroups(x, sampleRate, freq.hz, mains, maxOrder) : null;

  const meters = meterReadings(f);
  const clipping = settings.clipping ?? findClipping(x, 0, x.length, whole.min, whole.max);
  return {
    window: {
      startS: t0 + win.startIndex / sampleRate,
      endS: t0 + (win.startIndex + win.sampleCount) / sampleRate,
      cycles: win.cycles,
      startIndex: win.startIndex,
      sampleCount: win.sampleCount,
    },
    sampleRate,
    mean: f.mean,
    rms: f.rms,
    acRms: f.acRms,
    rectifiedAverage: f.rectifiedAverage,
    acRectifiedAverage: f.acRectifiedAverage,
    peak: f.peak,
    min: f.min,
    max: f.max,
    peakToPeak: f.peakToPeak,
    crestFactor: f.crestFactor,
    formFactor: f.formFactor,
    frequency: freq.hz,
    frequencyDetail: freq.detail,
    harmonics: harm?.harmonics ?? [],
    thdPercent: harm?.thdPercent ?? null,
    thdRPercent: harm?.thdRPercent ?? null,
    iec,
    meters,
    warnings: analysisWarnings({
      figures: f,
      meters,
      cycles: win.cycles,
      periodic: freq.hz !== null,
      requestedOrder: maxOrder,
      nyquistOrder: harm?.nyquistOrder ?? null,
      clipping,
    }),
  };
}
