import { looksLikeIndexName, looksLikeTimeName, looksLikeUnit, normaliseUnit, parseColumnHeader, timeUnitScale, type ColumnHeader } from './columnHeader';
import { CsvError } from './CsvError';
import { headTooLong, nameTooLong, tooManyChannels } from './limitErrors';
import { cellValue, cleanCell } from './numberCells';
import { intervalFromPreamble, parsePreambleLine, unitFromPreamble, type PreambleEntry } from './preamble';
import { resolveReadLimits, type ReadLimits } from './readLimits';
import { splitLine, type Delimiter } from './splitLine';
import { leadingMark, unwrap } from './textScan';

/** How a capture file is laid out, found from its first lines. */
export interface CaptureLayout {
  delimiter: Delimiter;
  decimal: '.' | ',';
  /** Every data line ends with a delimiter (an empty last cell to ignore). */
  trailingDelimiter: boolean;
  /** Cells per data line, without a trailing empty one. */
  fieldCount: number;
  /** 1-based file line of the first data row. */
  dataStartLine: number;
  headerLine: number | null;
  unitsLine: number | null;
  columns: ColumnHeader[];
  timeColumn: number | null;
  /** Seconds per unit of the time column. */
  timeScale: number;
  /** A sample-number column, which is neither time nor a channel. */
  indexColumn: number | null;
  preamble: PreambleEntry[];
  interval: { seconds: number; key: string; line: number } | null;
}

const DIALECTS: { delimiter: Delimiter; decimal: '.' | ',' }[] = [
  { delimiter: ',', decimal: '.' },
  { delimiter: ';', decimal: '.' },
  { delimiter: '\t', decimal: '.' },
  { delimiter: 'whitespace', decimal: '.' },
  { delimiter: ';', decimal: ',' },
  { delimiter: '\t', decimal: ',' },
  { delimiter: 'whitespace', decimal: ',' },
];

const isBlank = (s: string) => s.trim() === '';

/** Cells of a line under a dialect, or null when it is not a data line (text, or no real number). */
function dataCells(line: string, delimiter: Delimiter, decimal: '.' | ','): { cells: number; trailing: boolean } | null {
  const cells = splitLine(line, delimiter);
  let trailing = false;
  if (cells.length > 1 && delimiter !== 'whitespace' && cleanCell(cells[cells.length - 1]) === '') {
    cells.pop();
    trailing = true;
  }
  let real = 0;
  for (const c of cells) {
    const v = cellValue(c, decimal);
    if (v === undefined) return null;
    if (!Number.isNaN(v)) real++;
  }
  return real > 0 ? { cells: cells.length, trailing } : null;
}

interface Run {
  delimiter: Delimiter;
  decimal: '.' | ',';
  start: number;
  length: number;
  fields: number;
  trailing: boolean;
  headerFits: boolean;
}

/**
 * Where the data starts under one dialect: the first data line from which at least 60 % of the
 * non-blank lines are data rows with the same cell count. A bad row further down does not move the
 * start; the body reader reports it with its line.
 */
function dataRun(lines: string[], d: { delimiter: Delimiter; decimal: '.' | ',' }): Run | null {
  const parsed = lines.map((l) => (isBlank(l) ? undefined : dataCells(l, d.delimiter, d.decimal)));
  const counts = new Map<number, number>();
  for (const p of parsed) if (p) counts.set(p.cells, (counts.get(p.cells) ?? 0) + 1);
  if (counts.size === 0) return null;
  const fields = [...counts.entries()].reduce((a, b) => (b[1] > a[1] || (b[1] === a[1] && b[0] > a[0]) ? b : a))[0];
  let nonBlankAfter = lines.filter((l) => !isBlank(l)).length;
  let dataAfter = counts.get(fields) ?? 0;
  for (let i = 0; i < lines.length; i++) {
    const p = parsed[i];
    if (p && p.cells === fields && dataAfter >= 0.6 * nonBlankAfter) {
      let above = i - 1;
      while (above >= 0 && isBlank(lines[above])) above--;
      const headerFits = above >= 0 && headerCells(lines[above], d.delimiter, p.trailing).length === fields;
      return { ...d, start: i, length: dataAfter, fields, trailing: p.trailing, headerFits };
    }
    if (!isBlank(lines[i])) {
      nonBlankAfter--;
      if (p && p.cells === fields) dataAfter--;
    }
  }
  return null;
}

function headerCells(line: string, delimiter: Delimiter, trailing: boolean): string[] {
  let cells = splitLine(line, delimiter).map(cleanCell);
  if (delimiter === 'whitespace') {
    // "CH1 (V)" is one title even when spaces separate the columns.
    cells = cells.reduce<string[]>((out, c) => {
      if (c !== '' && '([{'.includes(c[0]) && out.length > 0) out[out.length - 1] += ` ${c}`;
      else out.push(c);
      return out;
    }, []);
  }
  if (trailing && cells.length > 1 && cells[cells.length - 1] === '') cells.pop();
  return cells;
}

/** A first column that rises by a near-constant step: a time axis, even without a header saying so. */
function risesSteadily(lines: string[], start: number, run: Run, column: number): { steady: boolean; integers: boolean } {
  const values: number[] = [];
  for (let i = start; i < lines.length && values.length < 50; i++) {
    if (isBlank(lines[i])) continue;
    const cells = splitLine(lines[i], run.delimiter);
    const v = cellValue(cells[column] ?? '', run.decimal);
    if (v === undefined || Number.isNaN(v)) return { steady: false, integers: false };
    values.push(v);
  }
  if (values.length < 3) return { steady: false, integers: false };
  const span = values[values.length - 1] - values[0];
  const step = span / (values.length - 1);
  if (!(step > 0)) return { steady: false, integers: false };
  const steady = values.every((v, i) => Math.abs(v - (values[0] + i * step)) <= 0.51 * step);
  return { steady, integers: values.every((v) => Number.isInteger(v)) && step === 1 };
}

const COMMENT_MARKS = ['#', '%', '//'];

/** Refuses a title or preamble entry over the name limit, naming it and its line. */
function checkName(what: string, text: string, line: number, maxNameChars: number): void {
  if (text.length > maxNameChars) throw nameTooLong(what, line, text.length, maxNameChars);
}

/** What sniffLayout is told besides the lines. */
export interface SniffOptions {
  /** Limits on columns and on the length of names; the defaults where not given. */
  limits?: Partial<ReadLimits>;
  /**
   * The file line that the head limit cut off: `lines` stop before it although the file goes on. When no
   * data is found in them, the error names the head limit rather than the lines.
   */
  cutBeforeLine?: number | null;
}

/**
 * Finds delimiter, decimal mark, preamble, header (with units in the titles or on a row of their own),
 * time column and data start from the first lines of a file. Linear in the length of the lines; refuses
 * with a `too_large` CsvError more channels than `limits.maxChannels`, or a title or preamble key or value
 * longer than `limits.maxNameChars` characters.
 *
 * @param lines the head of the file split into lines (the last one complete)
 * @param firstLine the file line number of lines[0]
 */
export function sniffLayout(lines: string[], firstLine = 1, options: SniffOptions = {}): CaptureLayout {
  const limits = resolveReadLimits(options.limits);
  const runs = DIALECTS.map((d) => dataRun(lines, d)).filter((r): r is Run => r !== null);
  if (runs.length === 0) {
    if (options.cutBeforeLine) throw headTooLong(options.cutBeforeLine, limits.maxHeadBytes);
    if (lines.every(isBlank)) throw new CsvError('The file holds no data, only blank lines.', undefined, 'empty');
    // Name the first line after a possible header: that is where numbers were expected.
    const nonBlank = lines.map((l, i) => (isBlank(l) ? -1 : i)).filter((i) => i >= 0);
    const at = nonBlank[Math.min(1, nonBlank.length - 1)];
    throw new CsvError(`No numeric data found: line ${firstLine + at} is not a row of numbers (expected values separated by commas, semicolons, tabs or spaces).`, firstLine + at);
  }
  const score = (r: Run) => r.length * 2 + (r.headerFits ? 3 : 0) + Math.min(r.fields, 8) * 0.01;
  const run = runs.reduce((best, r) => (score(r) > score(best) ? r : best));

  const above: number[] = [];
  for (let i = run.start - 1; i >= 0; i--) if (!isBlank(lines[i])) above.push(i);
  const textRow = (i: number | undefined) => {
    if (i === undefined || leadingMark(lines[i], COMMENT_MARKS)) return null;
    const cells = headerCells(lines[i], run.delimiter, run.trailing);
    return cells.length === run.fields && cells.some((c) => cellValue(c, run.decimal) === undefined) ? cells : null;
  };
  let headerIdx: number | null = null;
  let unitsIdx: number | null = null;
  const nearest = textRow(above[0]);
  const second = textRow(above[1]);
  if (nearest && second && nearest.every((c) => c === '' || looksLikeUnit(c))) {
    headerIdx = above[1];
    unitsIdx = above[0];
  } else if (nearest) {
    headerIdx = above[0];
  }
  // A time and a sample-number column may come on top of the channels; which they are is known below.
  if (run.fields > limits.maxChannels + 2) throw tooManyChannels(run.fields, null, limits.maxChannels, firstLine + (headerIdx ?? run.start));
  const preambleEnd = headerIdx ?? run.start;
  const preamble: PreambleEntry[] = [];
  for (let i = 0; i < preambleEnd; i++) {
    const e = parsePreambleLine(lines[i], firstLine + i, run.delimiter);
    if (!e) continue;
    checkName('Header key', e.key, e.line, limits.maxNameChars);
    checkName('Header value', e.value, e.line, limits.maxNameChars);
    preamble.push(e);
  }

  const names = headerIdx !== null ? headerCells(lines[headerIdx], run.delimiter, run.trailing) : null;
  const units = unitsIdx !== null ? headerCells(lines[unitsIdx], run.delimiter, run.trailing) : null;
  // A units row is one only when every cell looks like a unit, so its cells are short by construction.
  for (const name of names ?? []) checkName('Column title', name, firstLine + (headerIdx as number), limits.maxNameChars);
  const columns: ColumnHeader[] = Array.from({ length: run.fields }, (_, i) => {
    const parsed = names ? parseColumnHeader(names[i]) : { name: '', unit: '' };
    const unit = units?.[i] ? normaliseUnit(unwrap(units[i], '([', ')]')) : parsed.unit;
    return { name: parsed.name, unit };
  });

  let timeColumn: number | null = columns.findIndex((c) => looksLikeTimeName(c.name) || (c.unit !== '' && timeUnitScale(c.unit) !== null));
  let indexColumn: number | null = columns.findIndex((c) => looksLikeIndexName(c.name));
  if (timeColumn < 0) timeColumn = null;
  if (indexColumn < 0 || indexColumn === timeColumn) indexColumn = null;
  if (timeColumn === null && indexColumn === null && run.fields > 1 && !names && !intervalFromPreamble(preamble)) {
    const first = risesSteadily(lines, run.start, run, 0);
    if (first.integers) indexColumn = 0;
    else if (first.steady) timeColumn = 0;
  }
  const channels = run.fields - (timeColumn !== null ? 1 : 0) - (indexColumn !== null ? 1 : 0);
  if (channels > limits.maxChannels) throw tooManyChannels(run.fields, channels, limits.maxChannels, firstLine + (headerIdx ?? run.start));
  const timeScale = timeColumn !== null ? (timeUnitScale(columns[timeColumn].unit || 's') ?? 1) : 1;

  const fallbackUnit = unitFromPreamble(preamble);
  let channelNo = 0;
  columns.forEach((c, i) => {
    if (i === timeColumn) {
      if (!c.name) c.name = 'Time';
      if (!c.unit) c.unit = 's';
      return;
    }
    if (i === indexColumn) return;
    channelNo++;
    if (!c.name) c.name = `CH${channelNo}`;
    if (!c.unit && fallbackUnit) c.unit = fallbackUnit;
  });

  return {
    delimiter: run.delimiter,
    decimal: run.decimal,
    trailingDelimiter: run.trailing,
    fieldCount: run.fields,
    dataStartLine: firstLine + run.start,
    headerLine: headerIdx !== null ? firstLine + headerIdx : null,
    unitsLine: unitsIdx !== null ? firstLine + unitsIdx : null,
    columns,
    timeColumn,
    timeScale,
    indexColumn,
    preamble,
    interval: intervalFromPreamble(preamble),
  };
}
