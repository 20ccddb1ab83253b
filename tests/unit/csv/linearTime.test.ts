/**
 * Reading time grows linearly with the text: the body with a million blank lines. The cap guards the
 * complexity, not the speed (speed targets live in the bench).
 */
import { describe, expect, it } from 'vitest';
import { CsvError } from '../../../shared/csv';
import { readCaptureBytes } from '../../../shared/csv/readCaptureBytes';

const encoder = new TextEncoder();

/** Milliseconds a step takes, whether it returns or refuses with a CsvError (anything else is a bug). */
function msToRead(step: () => unknown): number {
  const start = performance.now();
  try {
    step();
  } catch (e) {
    if (!(e instanceof CsvError)) throw e;
  }
  return performance.now() - start;
}

describe('the body stays linear', () => {
  it('a million blank lines between rows are skipped in well under 2 s', () => {
    // Each blank line used to send the fast path searching for the next delimiter, which lay beyond all
    // of them: 640,000 such lines took 10 s, quadratic in their number.
    const text = `Time (s),CH1 (V)\n${Array.from({ length: 10 }, (_, i) => `${i},1\n`).join('')}${' \n'.repeat(1_000_000)}10,1\n`;
    let rows = 0;
    expect(msToRead(() => (rows = readCaptureBytes([encoder.encode(text)]).rows))).toBeLessThan(2000);
    expect(rows).toBe(11);
  });
});
