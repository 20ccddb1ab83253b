import { REPORT_COLOURS as C } from '../../shared/reports/palette';
import { MAX_PAGES, PageLimitReached, type ReportWriter } from './pdf/ReportWriter';
import { safetySection } from './sections/notesSections';

/**
 * Writes the sections in order until the page limit stops them (then says so), always ends with the
 * safety cautions, and returns the finished PDF.
 */
export async function finishWithin(w: ReportWriter, sections: (() => void)[]): Promise<Buffer> {
  try {
    for (const s of sections) s();
  } catch (err) {
    if (!(err instanceof PageLimitReached)) throw err;
    // The cautions must be in every report: they get a page of their own past the limit if need be.
    if (w.y + 120 > w.bottom) w.doc.addPage();
    w.paragraph(`The report stops here: it reached its limit of ${MAX_PAGES} pages. The CSV and JSON exports hold every figure.`, { weight: 'bold', color: C.danger });
  }
  if (w.y + 180 > w.bottom) w.doc.addPage();
  safetySection(w);
  return w.finish();
}
