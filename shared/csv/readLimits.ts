/**
 * How much of a capture file the reader accepts before it refuses with a `too_large` CsvError. They keep
 * one upload from taking the memory or the time of the process reading it.
 */
export interface ReadLimits {
  /** Channel columns per capture; a time and a sample-number column come on top. */
  maxChannels: number;
  /** Characters in one column title, or one preamble key or value (a units cell is a unit, so short). */
  maxNameChars: number;
  /**
   * Characters of the head (preamble, header and units lines before the first row of data), and so of any
   * one line in it. Counted in characters of the decoded text, which are bytes for ASCII.
   */
  maxHeadBytes: number;
  /** Characters in one line of data. */
  maxLineChars: number;
  /** Characters in one cell of data. */
  maxCellChars: number;
  /** Rows × channels: each sample is held as a Float64 (8 bytes) while the file is read. */
  maxSamples: number;
}

/**
 * The limits a reader uses where its caller sets none. The line limit leaves room for 66 columns of
 * 100-character cells (6,666 characters) with any padding an instrument adds; 100 characters is far beyond
 * any number an instrument prints (common practice, no source). 200 M samples are 1.6 GB of Float64.
 */
export const DEFAULT_READ_LIMITS: Readonly<ReadLimits> = Object.freeze({
  maxChannels: 64,
  maxNameChars: 1024,
  maxHeadBytes: 1024 * 1024,
  maxLineChars: 64 * 1024,
  maxCellChars: 100,
  maxSamples: 200_000_000,
});

/**
 * The defaults overridden by what the caller gives. Each limit must be a positive number (Infinity turns
 * one off) and is rounded down to a whole number; anything else is a programming error and throws a RangeError.
 */
export function resolveReadLimits(given: Partial<ReadLimits> = {}): ReadLimits {
  const limits = { ...DEFAULT_READ_LIMITS };
  for (const key of Object.keys(DEFAULT_READ_LIMITS) as (keyof ReadLimits)[]) {
    const value = given[key];
    if (value === undefined) continue;
    const whole = Math.floor(value);
    if (!(whole >= 1)) throw new RangeError(`Read limit ${key} must be a positive number, not ${value}.`);
    limits[key] = whole;
  }
  return limits;
}
