import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Response } from 'superagent';

/** A supertest parser that keeps a binary body (a PDF) as a Buffer. */
export function binary(res: Response, done: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

function saved(pdf: Buffer): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'crestline-pdf-')), 'report.pdf');
  writeFileSync(file, pdf);
  return file;
}

/** The PDF's text as a reader would copy it out, through poppler's pdftotext. */
export function pdfText(pdf: Buffer): string {
  return execFileSync('pdftotext', ['-enc', 'UTF-8', saved(pdf), '-'], { encoding: 'utf8' });
}

/** The PDF's page count, through poppler's pdfinfo. */
export function pdfPages(pdf: Buffer): number {
  const info = execFileSync('pdfinfo', [saved(pdf)], { encoding: 'utf8' });
  return Number(/^Pages:\s+(\d+)/m.exec(info)?.[1]);
}

/** Keeps the PDF as test-results/reports/<name>.pdf and renders page `page` beside it as PNG at 60 dpi, for a person to look at. */
export function pdfPagePng(pdf: Buffer, name: string, page = 1, dpi = 60): string {
  const dir = path.resolve('test-results/reports');
  mkdirSync(dir, { recursive: true });
  const prefix = path.join(dir, name);
  writeFileSync(`${prefix}.pdf`, pdf);
  execFileSync('pdftoppm', ['-png', '-r', String(dpi), '-f', String(page), '-l', String(page), '-singlefile', saved(pdf), `${prefix}-${page}`]);
  return `${prefix}-${page}.png`;
}
