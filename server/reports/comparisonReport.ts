import { formatQuantity, formatUtc } from '../../shared/reports/formatQuantity';
import { REPORT_COLOURS as C } from '../../shared/reports/palette';
import { COMPARISON_ROWS } from '../../shared/reports/quantityRows';
import { formatPercent, formatSI } from '../../shared/units';
import type { ComparisonReportData } from './comparisonReportData';
import { finishWithin } from './finishWithin';
import { drawTimePlot } from './pdf/pdfPlot';
import { drawTable, type TableCell } from './pdf/pdfTable';
import { ReportWriter } from './pdf/ReportWriter';
import { warningsSection } from './sections/notesSections';
import { reportHeader } from './sections/reportHeader';

/** The side-by-side table: each capture's value, and below it its difference to the first capture. */
function sideBySide(d: ComparisonReportData): TableCell[][] {
  return COMPARISON_ROWS.map((r) => {
    const values = d.items.map((it) => r.get(it.analysis));
    const base = values[0];
    return [
      r.label,
      ...values.map((v, k) => {
        const unit = d.items[k].channel.unit;
        const value = formatQuantity(r.kind, v, unit);
        if (k === 0 || v === null || base === null) return value;
        const pct = base !== 0 ? formatPercent((100 * (v - base)) / Math.abs(base), 1) : '—';
        return `${value}\n${formatQuantity(r.kind, v - base, unit)} (${pct})`;
      }),
    ];
  });
}

/** A saved comparison's report as PDF: who and when, the overlay, the side-by-side table with differences, warnings and the safety cautions. */
export async function renderComparisonReport(d: ComparisonReportData): Promise<Buffer> {
  const title = d.author.options.title || `Comparison report: ${d.comparison.name}`;
  const preparedBy = [d.author.options.preparedBy || d.author.preparedBy, d.author.options.company].filter(Boolean).join(', ');
  const w = new ReportWriter({ title, subject: `The comparison “${d.comparison.name}”`, author: preparedBy, footer: `Crestline · ${d.comparison.name.slice(0, 70)} · generated ${formatUtc(d.generatedAt)}` });
  const align = d.comparison.settings.align === 'zeroCrossing' ? 'first rising zero crossing' : 'trigger';
  return finishWithin(w, [
    () =>
      reportHeader(w, 'Comparison report', title, [
        ['Comparison', d.comparison.name],
        ['Saved', `${d.comparison.createdBy ? `by ${d.comparison.createdBy.name}, ` : ''}${formatUtc(d.comparison.createdAt)}`],
        ...d.items.map((it, k): [string, string] => [`Capture ${k + 1}`, `${it.capture.name} · channel ${it.channel.name} (${it.channel.unit || 'no unit'}) · ${it.projectName ?? '—'} · ${formatSI(it.capture.sampleRate, 'Hz', 4).replace('Hz', 'S/s')}, ${formatSI(it.capture.durationS, 's', 4)}`]),
        ['Prepared by', preparedBy],
        ['Generated', formatUtc(d.generatedAt)],
      ], d.author.options),
    () => {
      w.heading('Overlay');
      w.paragraph(`Three cycles of each capture from its ${align}, on one time axis. The axis is in the first capture's unit (${d.items[0].channel.unit || 'no unit'}).`, { size: 8.5, color: C.muted });
      w.block(260, (box) =>
        drawTimePlot(w, box, { traces: d.overlay.traces, xRange: [0, d.overlay.spanS], xLabel: `Time from the ${align} (s)`, yLabel: d.items[0].channel.unit || 'value', yUnit: d.items[0].channel.unit }),
      );
    },
    () => {
      w.heading('Side by side');
      w.paragraph('Below each value after the first: its difference to the first capture, and that difference in % of the first.', { size: 8.5, color: C.muted });
      drawTable(w, [{ header: 'Quantity', share: 1.8 }, ...d.items.map((it) => ({ header: it.capture.name, share: 1.5, align: 'right' as const }))], sideBySide(d));
    },
    () => warningsSection(w, d.items.map((it) => ({ ...it.channel, name: `${it.capture.name} · ${it.channel.name}` })), d.items.map((it) => it.analysis)),
  ]);
}
