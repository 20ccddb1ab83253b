import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTable } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';

/** Header lines of the file listed at most, and characters of each value. */
const MAX_LINES = 40;
const MAX_VALUE = 200;

/** The instrument's own description of the capture: the file's header lines, and how the file was read. */
export function instrumentSection(w: ReportWriter, d: CaptureReportData): void {
  const c = d.capture;
  w.heading('Instrument and file');
  if (c.detected) {
    const det = c.detected;
    w.paragraph(
      `Read as ${det.encoding}${det.bom ? ' with BOM' : ''}, delimiter “${det.delimiter}”, decimal mark “${det.decimal}”, ${det.rows.toLocaleString('en')} rows; time base ${det.timeSource === 'column' ? `from the time column ${det.timeColumn ?? ''}` : det.timeSource === 'preamble' ? 'from the sample interval in the header lines' : 'from the sample rate given at upload'}, ${formatSI(c.sampleRate, 'Hz', 5).replace('Hz', 'S/s')}.`,
      { size: 8.5 },
    );
  }
  if (!c.metadata.length) {
    w.paragraph('The file has no header lines describing the instrument.', { size: 8.5, color: C.muted });
    return;
  }
  const cut = (s: string) => (s.length > MAX_VALUE ? `${s.slice(0, MAX_VALUE)}…` : s);
  drawTable(
    w,
    [{ header: 'Line', share: 0.5, align: 'right' }, { header: 'Header line of the file', share: 2 }, { header: 'Value', share: 4 }],
    c.metadata.slice(0, MAX_LINES).map((m) => [String(m.line), cut(m.key), cut(m.value)]),
  );
  if (c.metadata.length > MAX_LINES) w.paragraph(`The first ${MAX_LINES} of ${c.metadata.length} header lines.`, { size: 8, color: C.muted });
}
