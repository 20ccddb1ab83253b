import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { siQuantityOf } from '../../../shared/siUnits';
import { powerRows } from '../../../shared/reports/powerRows';
import { formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTable } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';


/** Power figures of each voltage/current pair, where the capture has both. */
export function powerSection(w: ReportWriter, d: CaptureReportData): void {
  if (!d.power.length) return;
  w.heading('Power');
  for (const p of d.power) {
    w.heading(`${p.voltage.name} with ${p.current.name}`, 2);
    if (!p.quantities) {
      w.paragraph(p.note ?? 'Not defined for this pair.', { color: C.muted });
      continue;
    }
    w.paragraph(`IEEE Std 1459-2010 quantities, single-phase, over ${p.quantities.window.cycles} whole cycles at ${formatSI(p.quantities.frequency, 'Hz', 5)}. Assumes the probes' polarity and scaling are right.`, { size: 8, color: C.muted });
    drawTable(w, [{ header: 'Quantity', share: 2.4 }, { header: 'Value', share: 1.3, align: 'right' }, { header: 'Formed as', share: 2.4 }], powerRows(p.quantities, (e) => `root of (${e})`));
  }
}

/**
 * Three-phase system figures (effective voltage and current, unbalance, positive-sequence powers) will
 * go here. Until they are computed, a capture with three or more voltage or current channels says so,
 * so that nobody reads the per-channel figures as system figures.
 */
export function systemSection(w: ReportWriter, d: CaptureReportData): void {
  const count = (q: 'voltage' | 'current') => d.capture.channels.filter((c) => siQuantityOf(c.unit)?.quantity === q).length;
  if (count('voltage') < 3 && count('current') < 3) return;
  w.heading('System figures');
  w.paragraph('This capture holds three or more voltage or current channels. Three-phase system figures (effective values, unbalance, positive-sequence power) are not computed by this version of Crestline; the figures above are per channel.');
}
