import { parse } from 'csv-parse/sync';

export type Delimiter = ',' | ';' | '\t' | 'whitespace';

/**
 * Cells of one line. Quoted cells (which may hold the delimiter) go through csv-parse; plain lines
 * through a split, which is all a numeric body needs.
 */
export function splitLine(line: string, delimiter: Delimiter): string[] {
  if (delimiter === 'whitespace') {
    const t = line.trim();
    return t === '' ? [] : t.split(/[ \t]+/);
  }
  if (line.includes('"')) {
    try {
      const rows = parse(line, { delimiter, relax_quotes: true, relax_column_count: true, skip_empty_lines: false }) as string[][];
      if (rows.length === 1) return rows[0];
    } catch {
      // fall through to a plain split: the reader reports what it cannot read, with the line
    }
  }
  return line.split(delimiter);
}
