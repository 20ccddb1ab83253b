import type { Samples } from './samples';

/** Share of the record the longest valid stretch must cover for its figures to stand for the record. */
export const MIN_VALID_SHARE = 0.5;

export interface ValidStretch {
  start: number;
  length: number;
  /** NaN samples (empty or overrange cells) in the whole record. */
  invalid: number;
}

/**
 * The longest run of samples without a NaN. Joining valid samples across a gap would splice the
 * waveform, so anything that needs an unbroken signal (frequency, harmonics, a meter's filters) takes
 * this run instead.
 */
export function longestValidStretch(x: Samples): ValidStretch {
  let invalid = 0;
  let start = 0;
  let length = 0;
  let runStart = 0;
  for (let i = 0; i <= x.length; i++) {
    if (i === x.length || Number.isNaN(x[i])) {
      if (i < x.length) invalid++;
      if (i - runStart > length) {
        start = runStart;
        length = i - runStart;
      }
      runStart = i + 1;
    }
  }
  return { start, length, invalid };
}

/** Why the stretch cannot stand for the record (too short), or null when it can. */
export function validStretchProblem(s: ValidStretch, total: number): string | null {
  if (s.length >= 2 && s.length >= MIN_VALID_SHARE * total) return null;
  return `${s.invalid} of ${total} samples are empty or overrange, and the longest valid stretch (${s.length} samples) is less than half the record; re-capture with a larger range.`;
}
