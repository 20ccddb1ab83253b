import { FIGURE_ROWS, METER_ERROR_ROWS, METER_READING_ROWS, unitOfKind, type QuantityRow } from '../../shared/reports/quantityRows';
import type { CaptureChannel } from '../../shared/schemas/capture';
import type { FiguresExport } from '../../shared/schemas/export';
import type { ReadyCapture } from '../services/readyCapture';

/** Every quantity figures.csv and figures.json carry: the figures, then the meter readings and their errors. */
const ROWS: QuantityRow[] = [...FIGURE_ROWS, ...METER_READING_ROWS, ...METER_ERROR_ROWS];

export interface ExportTable {
  header: string[];
  rows: (string | number | null)[][];
}

/** "L1-N (V)": a channel's column head, with its unit when it has one. */
export const channelHead = (c: CaptureChannel, what = '') => `${c.name}${what ? ` ${what}` : ''}${c.unit ? ` (${c.unit})` : ''}`;

/** A row's label with its own unit; quantities in the channel's unit take it from the column head. */
const rowLabel = (r: QuantityRow) => (r.kind === 'unit' || r.kind === 'ratio' ? r.label : `${r.label} (${unitOfKind(r.kind, '')})`);

/** figures.csv: one row per quantity, one column per channel, the units in the header and the labels. */
export function figuresTable({ detail, analyses }: ReadyCapture): ExportTable {
  return {
    header: ['Quantity', ...detail.channels.map((c) => channelHead(c))],
    rows: ROWS.map((r) => [rowLabel(r), ...analyses.map((a) => r.get(a))]),
  };
}

export function figuresJson({ detail, analyses }: ReadyCapture): FiguresExport {
  return {
    captureId: detail.id,
    name: detail.name,
    quantities: ROWS.map((r) => ({ key: r.key, label: r.label, unit: r.kind === 'unit' ? 'channel' : unitOfKind(r.kind, '') })),
    channels: detail.channels.map((c, i) => ({ index: c.index, name: c.name, unit: c.unit, values: Object.fromEntries(ROWS.map((r) => [r.key, r.get(analyses[i])])) })),
  };
}
