import { describeCheck, rowName, verdictWord } from '../../../shared/limits/describeCheck';
import { INDICATIVE_NOTE } from '../../../shared/limits/indicative';
import { formatUtc } from '../../../shared/reports/formatQuantity';
import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import type { StoredLimitCheck } from '../../../shared/schemas/compliance';
import { formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTable, type TableCell } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';
import { twoColumnRows } from '../pdf/twoColumnRows';

const VERDICT_COLOUR = { pass: C.pass, fail: C.danger, 'not-applicable': C.muted } as const;

function checkRows(check: StoredLimitCheck): TableCell[][] {
  const { basis } = check.result;
  return check.result.rows.map((r) => [
    rowName(r),
    formatSI(r.measured, basis?.unit ?? ''),
    r.measuredPercent === null ? '—' : `${r.measuredPercent.toFixed(2)} %`,
    r.limit !== null ? formatSI(r.limit, 'A') : r.limitPercent !== null ? `${r.limitPercent.toFixed(2)} %` : '—',
    r.pass === null ? '—' : { text: r.pass ? 'pass' : 'FAIL', color: r.pass ? C.pass : C.danger, bold: !r.pass },
  ]);
}

/** The limit checks kept with the capture, each recomputed from the current analysis and labelled indicative. */
export function limitChecksSection(w: ReportWriter, d: CaptureReportData): void {
  w.heading('Harmonic limit checks (indicative)');
  w.paragraph(INDICATIVE_NOTE, { size: 8.5, color: C.muted });
  if (!d.checks.length) {
    w.paragraph('No limit checks were kept with this capture.', { color: C.muted });
    return;
  }
  for (const check of d.checks) {
    const channel = d.capture.channels[check.request.channel]?.name ?? `channel ${check.request.channel}`;
    w.heading(`${channel}: ${describeCheck(check.request)}`, 2);
    w.text(`${verdictWord[check.result.verdict]} (indicative)`, { weight: 'bold', size: 10, color: VERDICT_COLOUR[check.result.verdict] });
    w.paragraph(`${check.result.standard}. Kept${check.createdBy ? ` by ${check.createdBy.name}` : ''} on ${formatUtc(check.createdAt)}; computed again from the current analysis for this report.`, { size: 8, color: C.muted });
    if (check.result.reason) w.paragraph(check.result.reason);
    if (check.result.rows.length) {
      const t = twoColumnRows(
        [{ header: 'Order', share: 0.7, align: 'right' }, { header: 'Measured', share: 1.2, align: 'right' }, { header: '%', share: 1, align: 'right' }, { header: 'Limit', share: 1.1, align: 'right' }, { header: 'Verdict', share: 0.9, align: 'right' }],
        checkRows(check),
      );
      if (check.result.basis) w.paragraph(`Percentages of the ${{ nominalVoltage: 'nominal voltage', loadCurrent: 'load current I_L', fundamental: 'measured fundamental' }[check.result.basis.of]}, ${formatSI(check.result.basis.value, check.result.basis.unit)}.`, { size: 8 });
      drawTable(w, t.columns, t.rows);
    }
    for (const n of check.result.notes.slice(1)) w.paragraph(`•  ${n}`, { size: 8 });
  }
}
