import type { ChannelAnalysis } from '../schemas/analysis';

/** How a quantity is measured: in the channel's own unit, or in a unit of its own. */
export type QuantityKind = 'unit' | 'ratio' | 'hz' | 'percent' | 'cycles' | 'seconds';

/** One quantity of a channel's analysis, as every table of figures (screen, PDF, CSV, JSON) names it. */
export interface QuantityRow {
  key: string;
  label: string;
  kind: QuantityKind;
  get: (a: ChannelAnalysis) => number | null;
}

/** The unit a quantity of this kind prints with, given the channel's unit. */
export function unitOfKind(kind: QuantityKind, channelUnit: string): string {
  return { unit: channelUnit, ratio: '', hz: 'Hz', percent: '%', cycles: 'cycles', seconds: 's' }[kind];
}

export const FIGURE_ROWS: QuantityRow[] = [
  { key: 'rms', label: 'True RMS (AC+DC)', kind: 'unit', get: (a) => a.rms },
  { key: 'acRms', label: 'AC RMS', kind: 'unit', get: (a) => a.acRms },
  { key: 'mean', label: 'DC mean', kind: 'unit', get: (a) => a.mean },
  { key: 'rectifiedAverage', label: 'Rectified average', kind: 'unit', get: (a) => a.rectifiedAverage },
  { key: 'peak', label: 'Peak', kind: 'unit', get: (a) => a.peak },
  { key: 'min', label: 'Minimum', kind: 'unit', get: (a) => a.min },
  { key: 'max', label: 'Maximum', kind: 'unit', get: (a) => a.max },
  { key: 'peakToPeak', label: 'Peak-to-peak', kind: 'unit', get: (a) => a.peakToPeak },
  { key: 'crestFactor', label: 'Crest factor', kind: 'ratio', get: (a) => a.crestFactor },
  { key: 'formFactor', label: 'Form factor', kind: 'ratio', get: (a) => a.formFactor },
  { key: 'frequency', label: 'Frequency', kind: 'hz', get: (a) => a.frequency },
  { key: 'thdF', label: 'THD-F', kind: 'percent', get: (a) => a.thdPercent },
  { key: 'thdR', label: 'THD-R', kind: 'percent', get: (a) => a.thdRPercent },
  { key: 'windowCycles', label: 'Window, whole cycles', kind: 'cycles', get: (a) => a.window.cycles },
  { key: 'windowLength', label: 'Window length', kind: 'seconds', get: (a) => a.window.endS - a.window.startS },
];

export const METER_READING_ROWS: QuantityRow[] = [
  { key: 'averageResponding', label: 'Average-responding meter', kind: 'unit', get: (a) => a.meters.averageResponding.reading },
  { key: 'trueRmsAc', label: 'AC true RMS meter', kind: 'unit', get: (a) => a.meters.trueRmsAc.reading },
  { key: 'trueRmsAcDc', label: 'AC+DC true RMS meter', kind: 'unit', get: (a) => a.meters.trueRmsAcDc.reading },
  { key: 'peakResponding', label: 'Peak-responding meter', kind: 'unit', get: (a) => a.meters.peakResponding.reading },
];

export const METER_ERROR_ROWS: QuantityRow[] = [
  { key: 'averageRespondingError', label: 'Average-responding meter error', kind: 'percent', get: (a) => a.meters.averageResponding.errorPercent },
  { key: 'trueRmsAcError', label: 'AC true RMS meter error', kind: 'percent', get: (a) => a.meters.trueRmsAc.errorPercent },
  { key: 'trueRmsAcDcError', label: 'AC+DC true RMS meter error', kind: 'percent', get: (a) => a.meters.trueRmsAcDc.errorPercent },
  { key: 'peakRespondingError', label: 'Peak-responding meter error', kind: 'percent', get: (a) => a.meters.peakResponding.errorPercent },
];

const COMPARED = new Set(['rms', 'acRms', 'mean', 'rectifiedAverage', 'peak', 'peakToPeak', 'crestFactor', 'formFactor', 'frequency', 'thdF', 'thdR']);

/** The side-by-side table of a comparison: the main figures, then what each meter would read. */
export const COMPARISON_ROWS: QuantityRow[] = [...FIGURE_ROWS.filter((r) => COMPARED.has(r.key)), ...METER_READING_ROWS];
