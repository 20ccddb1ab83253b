/**
 * resampleLoop and the display's counts. For a whole number of samples per output, the loop's
 * resampling is the engine's decimateByAverage (an independent implementation of the same average);
 * for any ratio it keeps the loop's mean and duration (integral of a held signal, standard calculus).
 * Display resolution: a 6000-count display shows 600.0 V on a 600 V range (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { displayed, displayResolution, resampleLoop, resolveFrontEnd } from '../../../shared/analysis';
import { decimateByAverage } from '../../../shared/analysis/decimate';
import { sampled, shapes } from '../../helpers/signals';

describe('resampleLoop', () => {
  it('by a whole factor is decimateByAverage', () => {
    const x = sampled(shapes.triangle(2), 600, 3);
    const a = resampleLoop(x, 300);
    const b = decimateByAverage(x, 6);
    expect(a.length).toBe(b.length);
    expect(a.every((v, i) => Math.abs(v - b[i]) < 1e-13)).toBe(true);
  });

  it('by any ratio keeps the mean of the loop, so its DC reading', () => {
    const x = sampled(shapes.dcPlusSine(1.5, 2), 1000, 7);
    const mean = (v: Float64Array) => v.reduce((s, y) => s + y, 0) / v.length;
    for (const m of [6999, 4321, 97, 1]) expect(mean(resampleLoop(x, m))).toBeCloseTo(mean(x), 12);
    expect(() => resampleLoop(x, 0)).toThrow(/whole number/);
  });
});

describe('displayResolution and displayed', () => {
  const p = (over: object) => resolveFrontEnd({ type: 'trueRms', coupling: 'ac', averagingTauS: 1, ...over });

  it('fixed range: one count is 10^⌈log₁₀(full scale/counts)⌉; beyond full scale the display shows over-range', () => {
    expect(displayResolution(p({ counts: 6000, rangeFullScale: 600 }), 230)).toBeCloseTo(0.1, 15);
    expect(displayResolution(p({ counts: 6000, rangeFullScale: 1000 }), 230)).toBe(1);
    expect(displayed(230.04, 0.1, 600)).toBe(230);
    expect(displayed(230.06, 0.1, 600)).toBe(230.1);
    expect(displayed(600.5, 0.1, 600)).toBeNull();
  });

  it('auto-ranging: the finest decade range that holds the reading; no counts, no rounding', () => {
    expect(displayResolution(p({ counts: 6000 }), 230)).toBeCloseTo(0.1, 15);
    expect(displayResolution(p({ counts: 6000 }), 600)).toBe(1);
    expect(displayResolution(p({ counts: 4000 }), 0.012)).toBeCloseTo(1e-5, 18);
    expect(displayResolution(p({}), 230)).toBeNull();
    expect(displayed(230.0449, null, null)).toBe(230.0449);
  });
});
