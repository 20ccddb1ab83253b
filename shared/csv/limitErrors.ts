import { CsvError } from './CsvError';

/** Every refusal for going over one of the ReadLimits: code `too_large`, the limit and the line named. */

const count = (n: number) => n.toLocaleString('en-US');

/** A character count as people read it: "1 MiB", "64 KiB", or "1,000 characters". */
function size(chars: number): string {
  if (chars >= 1024 * 1024 && chars % (1024 * 1024) === 0) return `${count(chars / (1024 * 1024))} MiB`;
  if (chars >= 1024 && chars % 1024 === 0) return `${count(chars / 1024)} KiB`;
  return `${count(chars)} characters`;
}

/** A line of the head that does not end within the head limit. */
export function headLineTooLong(line: number, maxHeadBytes: number): CsvError {
  return new CsvError(`Line ${line} is longer than ${count(maxHeadBytes)} characters; the header lines may hold at most ${size(maxHeadBytes)}.`, line, 'too_large');
}

/** Header lines that fill the head limit before any row of data. */
export function headTooLong(line: number, maxHeadBytes: number): CsvError {
  return new CsvError(`No row of data within the first ${size(maxHeadBytes)} of the file (line ${line} ends beyond it); the header lines may hold at most ${size(maxHeadBytes)}.`, line, 'too_large');
}

/** More columns than channels allowed, counting a time and a sample-number column when there are any. */
export function tooManyChannels(columns: number, channels: number | null, maxChannels: number, line: number): CsvError {
  const found = channels === null ? `${count(columns)} columns` : `${count(columns)} columns, ${count(channels)} of them channels`;
  return new CsvError(`The file has ${found}; Crestline reads at most ${count(maxChannels)} channels per capture.`, line, 'too_large');
}

/** A title or preamble key or value longer than maxNameChars; `what` starts the sentence ("Column title"). */
export function nameTooLong(what: string, line: number, length: number, maxNameChars: number): CsvError {
  return new CsvError(`${what} on line ${line} is ${count(length)} characters long; at most ${count(maxNameChars)} are allowed.`, line, 'too_large');
}

/** A line of data longer than maxLineChars; `length` is null when the line has not ended yet. */
export function dataLineTooLong(line: number, length: number | null, maxLineChars: number): CsvError {
  const has = length === null ? `more than ${count(maxLineChars)}` : count(length);
  return new CsvError(`Line ${line} has ${has} characters; a row of data may hold at most ${count(maxLineChars)}.`, line, 'too_large');
}

/** A cell of data longer than maxCellChars. */
export function cellTooLong(line: number, column: number, length: number, maxCellChars: number): CsvError {
  return new CsvError(`Column ${column} on line ${line} holds ${count(length)} characters; a cell of data may hold at most ${count(maxCellChars)}.`, line, 'too_large');
}

/** The row on `line` takes the samples (rows × channels) beyond maxSamples. */
export function tooManySamples(line: number, maxSamples: number): CsvError {
  return new CsvError(`The file holds more than ${count(maxSamples)} samples (rows × channels), the most this server reads at once; split the capture.`, line, 'too_large');
}
