/** Cells some loggers write for an overrange or missing sample: counted, not errors. */
const INVALID_MARKERS = /^(nan|-nan|\+nan|n\/a|na|ol|-ol|over|overload|overrange|under|-+|inf|-inf|\+inf|infinity|-infinity|\+infinity|∞|-∞)$/i;

export const isInvalidMarker = (cell: string) => cell === '' || INVALID_MARKERS.test(cell);

/** Strips surrounding quotes and spaces from a cell. */
export function cleanCell(cell: string): string {
  let c = cell.trim();
  if (c.length >= 2 && c.charCodeAt(0) === 34 && c.charCodeAt(c.length - 1) === 34) c = c.slice(1, -1).trim();
  return c;
}

/**
 * A cell as a number under the given decimal mark: a finite number, NaN for an invalid-sample marker
 * (empty, NaN, OL, ---), or undefined for anything else (text).
 */
export function cellValue(raw: string, decimal: '.' | ','): number | undefined {
  const cell = cleanCell(raw);
  if (isInvalidMarker(cell)) return NaN;
  if (decimal === ',') {
    if (cell.includes('.')) return undefined;
    const v = Number(cell.replace(',', '.'));
    return Number.isFinite(v) ? v : undefined;
  }
  if (cell.includes(',')) return undefined;
  const v = Number(cell);
  return Number.isFinite(v) && !/^0x/i.test(cell) ? v : undefined;
}
