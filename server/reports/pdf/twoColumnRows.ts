import type { TableCell, TableColumn } from './pdfTable';

/**
 * A long, narrow table laid out as two side by side (the first half of the rows on the left, the rest
 * on the right), so 50 harmonic orders take half a page.
 */
export function twoColumnRows(columns: TableColumn[], rows: TableCell[][]): { columns: TableColumn[]; rows: TableCell[][] } {
  const half = Math.ceil(rows.length / 2);
  const blank = columns.map(() => '');
  return {
    columns: [...columns, ...columns],
    rows: rows.slice(0, half).map((r, i) => [...r, ...(rows[half + i] ?? blank)]),
  };
}
