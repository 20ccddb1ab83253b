import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import { formatRatio, formatSI } from '../../shared/units';

/** One quantity of the figures table, the same on the capture page, the shared page and in a comparison. */
export interface FigureRow {
  /** Stable key: `data-test="figure-<key>"` in the table. */
  key: string;
  label: string;
  /** What the quantity is, shown as a tooltip and read as the row's description. */
  hint: string;
  /** The cell, in the channel's unit. */
  text: (a: ChannelAnalysis, unit: string) => string;
  /** The number a comparison takes differences of; absent for rows that describe rather than measure. */
  value?: (a: ChannelAnalysis) => number | null;
  /** How a difference of `value` prints. */
  difference?: (d: number, unit: string) => string;
}

const percent = (v: number | null) => (v === null ? '—' : `${v.toFixed(2)} %`);

/** A row whose cell is a number: the text, the value and its difference all print the same way. */
function measured(key: string, label: string, hint: string, value: (a: ChannelAnalysis) => number | null, print: (v: number | null, unit: string) => string): FigureRow {
  return { key, label, hint, value, text: (a, unit) => print(value(a), unit), difference: (d, unit) => print(d, unit) };
}
const inUnit = (v: number | null, unit: string) => formatSI(v, unit);
const ratio = (v: number | null) => formatRatio(v);

/** The figures of a channel, in the order the table shows them. */
export const FIGURE_ROWS: FigureRow[] = [
  measured('rms', 'True RMS (AC+DC)', 'What an AC+DC true RMS meter shows; heating value', (a) => a.rms, inUnit),
  measured('acRms', 'AC RMS', 'RMS of the AC part: what an AC-coupled true RMS meter shows', (a) => a.acRms, inUnit),
  measured('mean', 'DC mean', 'Average value', (a) => a.mean, inUnit),
  measured('rectifiedAverage', 'Rectified average', 'Mean of |x|', (a) => a.rectifiedAverage, inUnit),
  measured('peak', 'Peak', 'max |x|', (a) => a.peak, inUnit),
  { key: 'minmax', label: 'Min / max', hint: 'Extremes', text: (a, unit) => `${formatSI(a.min, unit)} / ${formatSI(a.max, unit)}` },
  measured('peakToPeak', 'Peak-to-peak', 'max − min', (a) => a.peakToPeak, inUnit),
  measured('crestFactor', 'Crest factor', 'Peak ÷ true RMS (a sine: 1.414)', (a) => a.crestFactor, ratio),
  measured('formFactor', 'Form factor', 'True RMS ÷ rectified average (a sine: 1.111)', (a) => a.formFactor, ratio),
  measured('frequency', 'Frequency', 'Fundamental, from zero crossings refined on the spectrum', (a) => a.frequency, (v) => formatSI(v, 'Hz', 6)),
  measured('thdF', 'THD-F', 'Harmonics 2…50 against the fundamental', (a) => a.thdPercent, percent),
  measured('thdR', 'THD-R', 'Harmonics 2…50 against the RMS of harmonics 1…50', (a) => a.thdRPercent, percent),
  {
    key: 'window',
    label: 'Window',
    hint: 'The span the figures cover',
    text: (a) => (a.window.cycles === null ? 'whole record (aperiodic)' : `${a.window.cycles} whole cycles, ${formatSI(a.window.endS - a.window.startS, 's', 4)}`),
  },
];

/** What each kind of meter would display: in a comparison, beside the figures. */
export const METER_ROWS: FigureRow[] = [
  measured('meterAverageResponding', 'Average-responding meter', 'Rectified average × 1.111, sine-calibrated', (a) => a.meters.averageResponding.reading, inUnit),
  measured('meterTrueRmsAc', 'AC true RMS meter', 'Blocks DC', (a) => a.meters.trueRmsAc.reading, inUnit),
  measured('meterTrueRmsAcDc', 'AC+DC true RMS meter', 'The whole signal', (a) => a.meters.trueRmsAcDc.reading, inUnit),
  measured('meterPeakResponding', 'Peak-responding meter', 'Peak ÷ √2, sine-calibrated', (a) => a.meters.peakResponding.reading, inUnit),
];
