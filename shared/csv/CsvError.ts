import { excerpt } from './excerpt';

/** Longest message a CsvError carries, in characters: it is stored with the failed capture and shown as is. */
export const MAX_MESSAGE_CHARS = 500;

/**
 * A capture file Crestline cannot read, with the 1-based line of the file where it went wrong. Codes:
 * `invalid_csv` (not a capture we can read), `needs_sample_rate` (no time base: the user must give one),
 * `not_text`, `empty`, and `too_large` (over one of the ReadLimits; the message names the limit).
 * A message longer than MAX_MESSAGE_CHARS is cut to it, whatever text it quotes.
 */
export class CsvError extends Error {
  constructor(
    message: string,
    readonly line?: number,
    readonly code: 'invalid_csv' | 'needs_sample_rate' | 'not_text' | 'empty' | 'too_large' = 'invalid_csv',
  ) {
    super(message.length <= MAX_MESSAGE_CHARS ? message : excerpt(message, MAX_MESSAGE_CHARS - 1));
    this.name = 'CsvError';
  }
}
