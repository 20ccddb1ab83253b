import { describeCheck } from '../../../shared/limits/describeCheck';
import { limitPercentOfFundamental } from '../../../shared/limits/limitValue';
import { CHANNEL_COLOURS } from '../../../shared/reports/palette';
import { siQuantityOf } from '../../../shared/siUnits';
import { formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawBarPlot } from '../pdf/pdfPlot';
import { drawTable } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';
import { twoColumnRows } from '../pdf/twoColumnRows';

/** Each channel's harmonics: a bar chart with the limit of a kept check, a table, and the IEC 61000-4-7 groups where computed. */
export function harmonicsSection(w: ReportWriter, d: CaptureReportData): void {
  w.heading('Harmonics', 1, 220);
  d.waveforms.forEach((s, k) => {
    const c = d.capture.channels[s.channel];
    const a = d.analyses[s.channel];
    // The chart goes with its heading and one line of figures.
    w.heading(c.unit ? `${c.name} (${c.unit})` : c.name, 2, a.harmonics.length > 1 ? 190 : 30);
    if (!a.harmonics.length) {
      w.paragraph('No harmonics: the record has no steady fundamental.');
      return;
    }
    const f1 = a.harmonics[0].rms;
    w.paragraph(`Fundamental ${formatSI(a.frequency, 'Hz', 5)}, ${formatSI(f1, c.unit)}; THD-F ${a.thdPercent?.toFixed(2) ?? '—'} %, THD-R ${a.thdRPercent?.toFixed(2) ?? '—'} % (orders 2 to ${a.harmonics.length}).`, { size: 8.5 });
    const check = d.checks.find((x) => x.request.channel === s.channel && x.result.verdict !== 'not-applicable');
    const limits = check ? limitPercentOfFundamental(check.result, f1 * (siQuantityOf(c.unit)?.factor ?? 1)) : null;
    const orders = a.harmonics.slice(1).map((h) => h.order);
    if (orders.length) {
      w.block(160, (box) =>
        drawBarPlot(w, box, {
          orders,
          values: a.harmonics.slice(1).map((h) => (100 * h.rms) / f1),
          limits: limits ? orders.map((o) => limits.get(o) ?? null) : undefined,
          color: CHANNEL_COLOURS[k % CHANNEL_COLOURS.length],
          label: `${c.name}, orders 2 to ${a.harmonics.length} (order 1 = 100 %)`,
          limitLabel: check ? `Limit, indicative: ${describeCheck(check.request)}` : undefined,
        }),
      );
    }
    const t = twoColumnRows(
      [{ header: 'Order', share: 0.7, align: 'right' }, { header: 'Frequency', share: 1.3, align: 'right' }, { header: 'RMS', share: 1.3, align: 'right' }, { header: '% of fund.', share: 1.1, align: 'right' }, { header: 'Phase (°)', share: 1, align: 'right' }],
      a.harmonics.map((h) => [String(h.order), formatSI(h.frequency, 'Hz', 5), formatSI(h.rms, c.unit), ((100 * h.rms) / f1).toFixed(2), h.phaseDeg.toFixed(1)]),
    );
    drawTable(w, t.columns, t.rows);
    if (a.iec) {
      w.paragraph(`IEC 61000-4-7 groups (${a.iec.mainsHz} Hz system, ${a.iec.cyclesPerWindow}-cycle windows × ${a.iec.windows}); THDG ${a.iec.thdgPercent?.toFixed(2) ?? '—'} %, THDS ${a.iec.thdsPercent?.toFixed(2) ?? '—'} %.`, { size: 8.5 });
      const g = twoColumnRows(
        [{ header: 'n', share: 0.5, align: 'right' }, { header: 'Group', share: 1.2, align: 'right' }, { header: 'Subgroup', share: 1.2, align: 'right' }, { header: 'Interharm. group', share: 1.3, align: 'right' }],
        a.iec.groups.map((x) => [String(x.order), formatSI(x.groupRms, c.unit), formatSI(x.subgroupRms, c.unit), formatSI(x.interharmonicGroupRms, c.unit)]),
      );
      drawTable(w, g.columns, g.rows);
    }
  });
}
