import PDFDocument from 'pdfkit';
import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { fontRuns, mainFont, registerReportFonts, type Weight } from './reportFonts';

export type Doc = InstanceType<typeof PDFDocument>;

/** A report stops adding sections at this many pages; one paragraph (≤ 4000 characters) may run one page past. */
export const MAX_PAGES = 40;

/** Thrown between two writes once the page limit is reached; the report ends with a note saying so. */
export class PageLimitReached extends Error {}

export interface TextStyle {
  weight?: Weight;
  size?: number;
  color?: string;
  align?: 'left' | 'right' | 'center';
  width?: number;
}

/**
 * A pdfkit document with Crestline's page layout: A4, Inter, a header band on the first page, a footer
 * with the page number on every page, and the few building blocks reports are made of. Text is real
 * text (selectable, copyable); plots are drawn as vector paths.
 */
export class ReportWriter {
  readonly doc: Doc;
  readonly left = 48;
  readonly width: number;
  readonly bottom: number;
  private readonly chunks: Buffer[] = [];
  private readonly done: Promise<Buffer>;

  constructor(private readonly meta: { title: string; subject: string; author: string; footer: string }) {
    this.doc = new PDFDocument({
      size: 'A4',
      margins: { top: 52, bottom: 56, left: this.left, right: 48 },
      bufferPages: true,
      info: { Title: meta.title, Subject: meta.subject, Author: meta.author, Creator: 'Crestline' },
    });
    registerReportFonts(this.doc);
    this.width = this.doc.page.width - this.left - 48;
    this.bottom = this.doc.page.height - 56;
    this.doc.on('data', (c: Buffer) => this.chunks.push(c));
    this.done = new Promise((resolve, reject) => {
      this.doc.on('end', () => resolve(Buffer.concat(this.chunks)));
      this.doc.on('error', reject);
    });
  }

  get y(): number {
    return this.doc.y;
  }

  get pageCount(): number {
    return this.doc.bufferedPageRange().count;
  }

  /** Starts a new page, unless the report is at its page limit. */
  newPage(): void {
    if (this.pageCount >= MAX_PAGES) throw new PageLimitReached();
    this.doc.addPage();
  }

  /** Makes room for `height` points, on a new page when this one has too little left. */
  ensureSpace(height: number): void {
    if (this.pageCount >= MAX_PAGES && this.doc.y + height > this.bottom) throw new PageLimitReached();
    if (this.doc.y + height > this.bottom) this.newPage();
  }

  /** Sets up font, size and colour for measuring or writing. */
  private style(s: TextStyle): Doc {
    return this.doc.font(mainFont(s.weight ?? 'regular')).fontSize(s.size ?? 9.5).fillColor(s.color ?? C.text);
  }

  heightOf(text: string, s: TextStyle = {}): number {
    return this.style(s).heightOfString(text || ' ', { width: s.width ?? this.width });
  }

  widthOf(text: string, s: TextStyle = {}): number {
    return this.style(s).widthOfString(text);
  }

  /** Writes text at (x, y), or flowing from the current position, each run in the Inter subset that has its glyphs. */
  text(text: string, s: TextStyle = {}, at?: { x: number; y: number }): void {
    const runs = fontRuns(text, s.weight ?? 'regular');
    const opts = { width: s.width ?? this.width, align: s.align ?? 'left', lineGap: 1.5 };
    runs.forEach((run, i) => {
      this.style(s).font(run.font);
      const more = { ...opts, continued: i < runs.length - 1 };
      if (i === 0) this.doc.text(run.text, at?.x ?? this.left, at?.y ?? this.doc.y, more);
      else this.doc.text(run.text, more);
    });
  }

  /** A section (1) or sub-section (2) heading, kept on a page with at least `keepWithNext` points of what follows. */
  heading(text: string, level: 1 | 2 = 1, keepWithNext = 60): void {
    const size = level === 1 ? 13 : 10.5;
    this.ensureSpace(size * 3 + keepWithNext);
    this.doc.moveDown(level === 1 ? 0.8 : 0.5);
    this.text(text, { weight: 'bold', size, color: level === 1 ? C.primary : C.text });
    if (level === 1) this.rule(C.rule);
    this.doc.moveDown(0.3);
  }

  paragraph(text: string, s: TextStyle = {}): void {
    this.ensureSpace(Math.min(this.heightOf(text, s), 60) + 4);
    this.text(text, s);
    this.doc.moveDown(0.35);
  }

  rule(color: string = C.rule): void {
    const y = this.doc.y + 2;
    this.doc.moveTo(this.left, y).lineTo(this.left + this.width, y).lineWidth(0.6).strokeColor(color).stroke();
    this.doc.y = y + 3;
  }

  /** Label and value pairs in two columns. */
  keyValues(pairs: [string, string][], labelWidth = 130): void {
    for (const [k, v] of pairs) {
      const h = Math.max(this.heightOf(k, { size: 8.5, width: labelWidth - 8 }), this.heightOf(v, { size: 8.5, width: this.width - labelWidth }));
      this.ensureSpace(h + 2);
      const y = this.doc.y;
      this.text(k, { size: 8.5, color: C.muted, width: labelWidth - 8 }, { x: this.left, y });
      this.text(v, { size: 8.5, width: this.width - labelWidth }, { x: this.left + labelWidth, y });
      this.doc.y = y + h + 2;
    }
    this.doc.x = this.left;
  }

  /** Reserves a block of `height` points (on a new page when needed) and hands its box to `draw`. */
  block(height: number, draw: (box: { x: number; y: number; width: number; height: number }) => void): void {
    this.ensureSpace(height);
    const y = this.doc.y;
    draw({ x: this.left, y, width: this.width, height });
    this.doc.x = this.left;
    this.doc.y = y + height;
  }

  /** Writes the page footers and ends the document; resolves with its bytes. */
  async finish(): Promise<Buffer> {
    const { start, count } = this.doc.bufferedPageRange();
    for (let i = start; i < start + count; i++) {
      this.doc.switchToPage(i);
      // Writing below the bottom margin would start a new page: lift the margin while the footer is written.
      const margin = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      const y = this.doc.page.height - 36;
      this.doc.moveTo(this.left, y - 6).lineTo(this.left + this.width, y - 6).lineWidth(0.5).strokeColor(C.rule).stroke();
      this.text(this.meta.footer, { size: 7, color: C.muted, width: this.width - 80 }, { x: this.left, y });
      this.text(`Page ${i + 1} of ${count}`, { size: 7, color: C.muted, width: 80, align: 'right' }, { x: this.left + this.width - 80, y });
      this.doc.page.margins.bottom = margin;
    }
    this.doc.end();
    return this.done;
  }
}
