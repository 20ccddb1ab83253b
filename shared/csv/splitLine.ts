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
      // One line is one record: a stray CR inside it would otherwise start a record of its own, and
      // csv-parse builds (and deep-copies) an error object for every record of another length, which took
      // 2 s on a 100 kB title.
      const rows = parse(line, { delimiter, record_delimiter: '\n', relax_quotes: true, relax_column_count: true, skip_empty_lines: false }) as string[][];
      if (rows.length === 1) return rows[0];
    } catch {
      // fall through to a plain split: the reader reports what it cannot read, with the line
    }
  }
  return line.split(delimiter);
}
