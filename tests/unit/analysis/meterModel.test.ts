/**
 * The meter model. First-order low-pass gain 1/√(1 + (f/fc)²) is circuit theory (any network-analysis
 * text; from memory). Crest-factor headroom growing as full scale / reading, and "±(% of reading + counts)"
 * accuracy specs, are common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { analyzeChannel, meterModel, timeDomainFigures } from '../../../shared/analysis';
import { fourierSeries, sampled, shapes } from '../../helpers/signals';

function input(x: Float64Array, fs: number) {
  const a = analyzeChannel(x, fs);
  return { figures: timeDomainFigures(x, a.window.startIndex, a.window.sampleCount), frequency: a.frequency, harmonics: a.harmonics };
}

describe('meterModel', () => {
  it('a band-limited true RMS meter sees Σ (X_h·|H(hf)|)²', () => {
    const terms = [{ order: 1, peak: 10 }, { order: 3, peak: 3 }, { order: 9, peak: 2 }];
    const inp = input(sampled(fourierSeries(terms), 1000, 10), 50000);
    const fc = 500;
    const p = meterModel({ type: 'trueRmsAc', bandwidthHz: fc }, inp);
    const expected = Math.sqrt(terms.reduce((s, t) => s + (t.peak / Math.SQRT2) ** 2 / (1 + ((50 * t.order) / fc) ** 2), 0));
    expect(p.reading).toBeCloseTo(expected, 9);
    expect(p.errorPercent!).toBeLessThan(0);
  });

  it('a 1 kHz meter reads a 100 Hz square wave low; an unlimited one reads it exactly', () => {
    const inp = input(sampled(shapes.square(1), 2000, 10), 200000);
    expect(meterModel({ type: 'trueRmsAc' }, inp).reading).toBeCloseTo(1, 9);
    const limited = meterModel({ type: 'trueRmsAc', bandwidthHz: 1000 }, inp);
    expect(limited.reading).toBeLessThan(0.99);
  });

  it('with unlimited bandwidth each type shows its idealised reading (square wave: averaging +11.07 %, peak −29.3 %)', () => {
    const inp = input(sampled(shapes.square(1), 2000, 10), 100000);
    expect(meterModel({ type: 'averageResponding' }, inp).errorPercent).toBeCloseTo(11.0721, 3);
    expect(meterModel({ type: 'peakResponding' }, inp).errorPercent).toBeCloseTo(-29.2893, 3);
    expect(meterModel({ type: 'trueRmsAcDc' }, inp).errorPercent).toBeCloseTo(0, 9);
  });

  it('an averaging meter with a very wide band matches the unlimited one', () => {
    const inp = input(sampled(fourierSeries([{ order: 1, peak: 1 }, { order: 3, peak: 0.3 }]), 2000, 10), 100000);
    const a = meterModel({ type: 'averageResponding' }, inp).reading;
    const b = meterModel({ type: 'averageResponding', bandwidthHz: 1e9 }, inp).reading;
    expect(b / a - 1).toBeLessThan(1e-5);
  });

  it('flags a crest factor beyond the converter headroom, allowing more at lower readings', () => {
    const inp = input(sampled(shapes.pulse(10, 0.05), 2000, 10), 100000); // AC crest factor (1 − D)/√(D(1 − D)) = 4.36
    const atFullScale = meterModel({ type: 'trueRmsAc', crestFactorLimit: 3, range: { fullScale: 2.2, displayCounts: 6000 } }, inp);
    expect(atFullScale.flags.map((f) => f.code)).toContain('crestFactorExceeded');
    const onHigherRange = meterModel({ type: 'trueRmsAc', crestFactorLimit: 3, range: { fullScale: 6, displayCounts: 6000 } }, inp);
    expect(onHigherRange.flags.map((f) => f.code)).not.toContain('crestFactorExceeded');
  });

  it('gives the interval ±(% of reading + counts × resolution)', () => {
    const inp = input(sampled(shapes.sine(100 * Math.SQRT2), 1000, 10), 50000);
    const p = meterModel({ type: 'trueRmsAc', range: { fullScale: 600, displayCounts: 6000 }, accuracy: { percentOfReading: 1, counts: 3 } }, inp);
    expect(p.reading).toBeCloseTo(100, 6);
    expect(p.high - p.reading).toBeCloseTo(1 + 3 * 0.1, 6);
    expect(p.low).toBeCloseTo(100 - 1.3, 6);
    expect(p.trueValueInsideInterval).toBe(true);
  });

  it('flags over-range and readings below 5 % of range', () => {
    const inp = input(sampled(shapes.sine(10), 1000, 10), 50000);
    expect(meterModel({ type: 'trueRmsAc', range: { fullScale: 6, displayCounts: 6000 } }, inp).flags.map((f) => f.code)).toContain('overRange');
    expect(meterModel({ type: 'trueRmsAc', range: { fullScale: 600, displayCounts: 6000 } }, inp).flags.map((f) => f.code)).toContain('belowSpecifiedRange');
  });

  it('says when an AC-coupled meter blocks a DC part', () => {
    const inp = input(sampled(shapes.dcPlusSine(50, 10), 1000, 10), 50000);
    const p = meterModel({ type: 'trueRmsAc' }, inp);
    expect(p.flags.map((f) => f.code)).toContain('dcBlocked');
    expect(p.reading).toBeCloseTo(10 / Math.SQRT2, 9);
  });
});
