import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import type { ReportWriter } from './ReportWriter';

export interface TableColumn {
  header: string;
  /** Share of the available width; the shares are scaled to fill it. */
  share: number;
  align?: 'left' | 'right';
}

/** A cell: its text, and optionally a colour and weight (a failing verdict in the danger colour, say). */
export type TableCell = string | { text: string; color?: string; bold?: boolean };

const PAD = 3;
const SIZE = 8;

/**
 * A table that breaks across pages, repeating its header on each. Row heights follow the tallest
 * wrapped cell; numbers are right-aligned by their column.
 */
export function drawTable(w: ReportWriter, columns: TableColumn[], rows: TableCell[][]): void {
  const total = columns.reduce((s, c) => s + c.share, 0);
  const widths = columns.map((c) => (c.share / total) * w.width);
  const xs = widths.map((_, i) => w.left + widths.slice(0, i).reduce((s, v) => s + v, 0));
  const cell = (c: TableCell) => (typeof c === 'string' ? { text: c } : c);
  const heightOf = (cells: TableCell[], bold: boolean) =>
    Math.max(...cells.map((c, i) => w.heightOf(cell(c).text, { size: SIZE, weight: bold || cell(c).bold ? 'bold' : 'regular', width: widths[i] - 2 * PAD }))) + 2 * PAD;

  const drawRow = (cells: TableCell[], header: boolean, shade: boolean) => {
    const h = heightOf(cells, header);
    const y = w.y;
    if (shade) w.doc.rect(w.left, y, w.width, h).fill(C.band);
    cells.forEach((c, i) => {
      const { text, color, bold } = cell(c);
      w.text(text, { size: SIZE, weight: header || bold ? 'bold' : 'regular', color: header ? C.muted : color ?? C.text, width: widths[i] - 2 * PAD, align: columns[i].align ?? 'left' }, { x: xs[i] + PAD, y: y + PAD });
    });
    w.doc.moveTo(w.left, y + h).lineTo(w.left + w.width, y + h).lineWidth(header ? 0.8 : 0.4).strokeColor(C.rule).stroke();
    w.doc.x = w.left;
    w.doc.y = y + h;
  };

  const header = columns.map((c) => c.header);
  const headerHeight = heightOf(header, true);
  // Never a header alone at the foot of a page: it goes with its first few rows.
  w.ensureSpace(headerHeight + rows.slice(0, 4).reduce((s, r) => s + heightOf(r, false), 0));
  drawRow(header, true, false);
  rows.forEach((r, k) => {
    const h = heightOf(r, false);
    if (w.y + h > w.bottom) {
      w.newPage();
      drawRow(header, true, false);
    }
    drawRow(r, false, k % 2 === 1);
  });
  w.doc.moveDown(0.6);
}
