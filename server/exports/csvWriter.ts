import type { CsvQuery } from '../../shared/schemas/export';

export interface CsvDialect {
  delimiter: ',' | ';';
  decimal: '.' | ',';
  bom: boolean;
}

export const UTF8_BOM = '\uFEFF';

/** The dialect a query asks for: a decimal comma goes with a semicolon delimiter and, unless refused, a BOM. */
export function csvDialect(q: CsvQuery): CsvDialect {
  return q.decimal === 'comma' ? { delimiter: ';', decimal: ',', bom: q.bom ?? true } : { delimiter: ',', decimal: '.', bom: q.bom ?? false };
}

/** Characters that make a spreadsheet read a cell as a formula (OWASP's list: = + - @, tab, carriage return). */
const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell: neutralised with a leading apostrophe when a spreadsheet would take it for a formula, quoted when needed. */
export function csvText(text: string, d: CsvDialect): string {
  const safe = FORMULA_START.test(text) ? `'${text}` : text;
  return safe.includes(d.delimiter) || /["\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/**
 * A number cell, never quoted or neutralised, so spreadsheets keep it a number: `significant` digits,
 * exponent form only for very small or large magnitudes, the dialect's decimal mark; empty for null or NaN.
 */
export function csvNumber(v: number | null, d: CsvDialect, significant = 12): string {
  if (v === null || !Number.isFinite(v)) return '';
  const s = String(Number(v.toPrecision(significant)));
  return d.decimal === '.' ? s : s.replace('.', ',');
}

/** One CRLF-terminated record (RFC 4180): strings as text cells, numbers as number cells. */
export function csvLine(cells: readonly (string | number | null)[], d: CsvDialect): string {
  return cells.map((c) => (typeof c === 'string' ? csvText(c, d) : csvNumber(c, d))).join(d.delimiter) + '\r\n';
}

/** A whole small table as CSV text, with the BOM when the dialect asks for it. */
export function csvDocument(header: readonly string[], rows: readonly (readonly (string | number | null)[])[], d: CsvDialect): string {
  return (d.bom ? UTF8_BOM : '') + csvLine(header, d) + rows.map((r) => csvLine(r, d)).join('');
}
