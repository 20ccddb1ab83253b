import { meterExplanation } from '../../../shared/analysis';
import { formatQuantity } from '../../../shared/reports/formatQuantity';
import { FIGURE_ROWS } from '../../../shared/reports/quantityRows';
import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { formatPercent, formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTable } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';

/** Channels per figures table: more columns would not fit the page's width. */
const CHANNELS_PER_TABLE = 4;

/** The figures table, one column per channel, in groups of four channels. */
export function figuresSection(w: ReportWriter, d: CaptureReportData): void {
  w.heading('Figures');
  const shown = d.waveforms.map((s) => d.capture.channels[s.channel]);
  for (let k = 0; k < shown.length; k += CHANNELS_PER_TABLE) {
    const group = shown.slice(k, k + CHANNELS_PER_TABLE);
    drawTable(
      w,
      [{ header: 'Quantity', share: 2.2 }, ...group.map((c) => ({ header: c.unit ? `${c.name} (${c.unit})` : c.name, share: 1.6, align: 'right' as const }))],
      FIGURE_ROWS.map((r) => [r.label, ...group.map((c) => formatQuantity(r.kind, r.get(d.analyses[c.index]), c.unit))]),
    );
  }
  if (d.capture.channels.length > shown.length) {
    w.paragraph(`This report covers the first ${shown.length} of ${d.capture.channels.length} channels; the others: ${d.capture.channels.slice(shown.length).map((c) => c.name).join(', ')}.`, { size: 8, color: C.muted });
  }
}

const METERS = [
  ['averageResponding', 'Average-responding, sine-calibrated (AC)'],
  ['trueRmsAc', 'True RMS, AC-coupled'],
  ['trueRmsAcDc', 'True RMS, AC+DC'],
  ['peakResponding', 'Peak-responding, sine-calibrated (AC)'],
] as const;

/** What each kind of meter would read on each channel, its error, and the one sentence on why. */
export function metersSection(w: ReportWriter, d: CaptureReportData): void {
  w.heading('Meter readings');
  for (const s of d.waveforms) {
    const c = d.capture.channels[s.channel];
    const a = d.analyses[s.channel];
    w.heading(c.unit ? `${c.name} (${c.unit})` : c.name, 2);
    drawTable(
      w,
      [{ header: 'Meter', share: 2.6 }, { header: 'Reading', share: 1.2, align: 'right' }, { header: 'Error', share: 1.2, align: 'right' }, { header: 'Against', share: 1.2 }, { header: 'Error vs AC+DC RMS', share: 1.4, align: 'right' }],
      METERS.map(([key, title]) => {
        const m = a.meters[key];
        const severe = m.errorPercent !== null && Math.abs(m.errorPercent) > 10;
        return [title, formatSI(m.reading, c.unit), { text: formatPercent(m.errorPercent), color: severe ? C.danger : C.text }, m.reference === 'acRms' ? 'AC RMS' : 'true RMS', formatPercent(m.errorVsTotalPercent)];
      }),
    );
    w.paragraph(meterExplanation(a), { size: 8.5 });
  }
}
