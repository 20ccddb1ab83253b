/** Longest message a capture keeps (the server stores at most this many characters). */
const MAX_MESSAGE = 500;
const MAX_FILE_NAME = 60;

/** A file name cut in the middle to at most `max` characters, so a long name cannot crowd out the reason. */
export function shortName(name: string, max = MAX_FILE_NAME): string {
  if (name.length <= max) return name;
  const keep = max - 1;
  return `${name.slice(0, Math.ceil(keep / 2))}…${name.slice(name.length - Math.floor(keep / 2))}`;
}

/** Where in which file a COMTRADE record went wrong: a 1-based line of a text file, or a byte offset of a binary one. */
export interface ComtradePlace {
  file: string;
  line?: number;
  offset?: number;
}

/**
 * A COMTRADE record Crestline cannot read. The message names the file and the line (text) or the byte
 * offset (binary), so it stands on its own wherever it is shown; `line` is also given apart for text.
 */
export class ComtradeError extends Error {
  readonly code = 'invalid_comtrade';
  readonly line?: number;
  readonly offset?: number;

  constructor(place: ComtradePlace, reason: string) {
    const where = place.line !== undefined ? `, line ${place.line}` : place.offset !== undefined ? `, byte ${place.offset.toLocaleString('en-US')}` : '';
    const full = `${shortName(place.file)}${where}: ${reason}`;
    super(full.length <= MAX_MESSAGE ? full : `${full.slice(0, MAX_MESSAGE - 1)}…`);
    this.name = 'ComtradeError';
    this.line = place.line;
    this.offset = place.offset;
  }
}
