import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import { formatPercent } from '../../shared/units';
import { FIGURE_ROWS, METER_ROWS, type FigureRow } from './figureRows';

export interface ComparisonCell {
  text: string;
  /** Against the first capture: the difference in the row's unit and in percent; empty for the first. */
  difference: string;
}

export interface ComparisonRow {
  key: string;
  label: string;
  hint: string;
  cells: ComparisonCell[];
}

function cell(row: FigureRow, a: ChannelAnalysis, unit: string, base: number | null, k: number): ComparisonCell {
  const v = row.value?.(a) ?? null;
  if (k === 0 || v === null || base === null || !row.difference) return { text: row.text(a, unit), difference: '' };
  const relative = base !== 0 ? formatPercent((100 * (v - base)) / Math.abs(base), 1) : '—';
  return { text: row.text(a, unit), difference: `${row.difference(v - base, unit)} (${relative})` };
}

/** The figures and meter readings of each compared channel, side by side, with differences to the first. */
export function comparisonRows(items: { analysis: ChannelAnalysis; unit: string }[]): ComparisonRow[] {
  return [...FIGURE_ROWS, ...METER_ROWS].map((row) => {
    const base = items[0] ? (row.value?.(items[0].analysis) ?? null) : null;
    return { key: row.key, label: row.label, hint: row.hint, cells: items.map((it, k) => cell(row, it.analysis, it.unit, base, k)) };
  });
}
