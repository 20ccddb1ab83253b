/** A capture file Crestline cannot read, with the 1-based line of the file where it went wrong. */
export class CsvError extends Error {
  constructor(
    message: string,
    readonly line?: number,
    readonly code: 'invalid_csv' | 'needs_sample_rate' | 'not_text' | 'empty' = 'invalid_csv',
  ) {
    super(message);
    this.name = 'CsvError';
  }
}
