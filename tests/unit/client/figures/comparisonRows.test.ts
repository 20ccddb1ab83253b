import { describe, expect, it } from 'vitest';
import { analyzeChannel } from '../../../../shared/analysis';
import { comparisonRows } from '../../../../src/figures/comparisonRows';
import { FIGURE_ROWS, METER_ROWS } from '../../../../src/figures/figureRows';

const FS = 10_000;
/** 10 cycles of a 50 Hz sine of the given peak, analysed by the engine. */
const sineOf = (peak: number) => analyzeChannel(Float64Array.from({ length: 2000 }, (_, i) => peak * Math.sin(2 * Math.PI * 50 * (i / FS))), FS);

describe('FIGURE_ROWS', () => {
  it('prints each figure in the channel unit: 325 V peak is 229.8 V true RMS (325/√2, standard calculus)', () => {
    const a = sineOf(325);
    const text = Object.fromEntries(FIGURE_ROWS.map((r) => [r.key, r.text(a, 'V')]));
    expect(text.rms).toBe('229.8 V');
    expect(text.peak).toBe('325.0 V');
    expect(text.crestFactor).toBe('1.414');
    expect(text.window).toBe('10 whole cycles, 200.0 ms');
  });
  it('keeps the keys the pages and their tests address', () => {
    expect(FIGURE_ROWS.map((r) => r.key)).toEqual(['rms', 'acRms', 'mean', 'rectifiedAverage', 'peak', 'minmax', 'peakToPeak', 'crestFactor', 'formFactor', 'frequency', 'thdF', 'thdR', 'window']);
  });
});

describe('comparisonRows', () => {
  const rows = comparisonRows([{ analysis: sineOf(325), unit: 'V' }, { analysis: sineOf(300), unit: 'V' }]);
  const row = (key: string) => rows.find((r) => r.key === key)!;

  it('lists the figures, then what each meter would read', () => {
    expect(rows.map((r) => r.key)).toEqual([...FIGURE_ROWS, ...METER_ROWS].map((r) => r.key));
  });
  it('gives the second capture its difference to the first, in the unit and in percent', () => {
    // (300 − 325)/√2 = −17.68 V, and −25/325 = −7.7 %.
    expect(row('rms').cells[1]).toEqual({ text: '212.1 V', difference: '-17.68 V (-7.7 %)' });
    expect(row('rms').cells[0].difference).toBe('');
  });
  it('gives no difference for rows that describe rather than measure', () => {
    expect(row('window').cells[1].difference).toBe('');
    expect(row('minmax').cells[1].difference).toBe('');
  });
});
