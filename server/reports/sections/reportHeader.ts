import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import type { ReportOptions } from '../../../shared/schemas/report';
import type { ReportWriter } from '../pdf/ReportWriter';

/** The app's logo mark (public/favicon.svg), drawn as vector paths at `size` points. */
function logo(w: ReportWriter, x: number, y: number, size: number): void {
  w.doc.save().translate(x, y).scale(size / 32);
  w.doc.roundedRect(0, 0, 32, 32, 7).fill(C.primary);
  w.doc.path('M4 20 C8 20 9 8 12 8 S15 24 18 24 S21 12 24 12 S27 16 28 16').lineWidth(2.6).lineCap('round').strokeColor(C.logoWave).stroke();
  w.doc.restore();
}

/**
 * The first lines of every report: the mark and name, what kind of report it is, its title, and the
 * facts of who made it, for whom and when.
 */
export function reportHeader(w: ReportWriter, kind: string, title: string, facts: [string, string][], options: ReportOptions): void {
  const top = w.y;
  logo(w, w.left, top, 22);
  w.text('Crestline', { weight: 'bold', size: 12, color: C.primary }, { x: w.left + 30, y: top + 1 });
  w.text(kind, { size: 8, color: C.muted, width: 200 }, { x: w.left + 30, y: top + 15 });
  w.doc.y = top + 34;
  w.text(title, { weight: 'bold', size: 17 });
  w.doc.moveDown(0.3);
  w.rule(C.primary);
  w.doc.moveDown(0.3);
  w.keyValues(facts, 120);
  if (options.summary) {
    w.heading('Summary', 2);
    w.paragraph(options.summary);
  }
}
