/** Properties every correct RMS and Fourier engine has (fast-check; the identities are standard signal theory). */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeChannel } from '../../../shared/analysis';
import { fourierSeries, sampled } from '../../helpers/signals';

const series = fc.record({
  dc: fc.double({ min: -5, max: 5, noNaN: true }),
  terms: fc.array(
    fc.record({ order: fc.integer({ min: 1, max: 12 }), peak: fc.double({ min: 0.01, max: 3, noNaN: true }), phaseRad: fc.double({ min: -3, max: 3, noNaN: true }) }),
    { minLength: 1, maxLength: 6 },
  ),
  cycles: fc.integer({ min: 3, max: 12 }),
  perCycle: fc.integer({ min: 64, max: 300 }),
});

/**
 * A fundamental whose slope outweighs all harmonics together (Σ h·peak_h < 5) crosses zero once per
 * cycle in each direction, so the period is unambiguous; these tests are about the figures, not about
 * frequency detection on pathological shapes.
 */
function build(s: { dc: number; terms: { order: number; peak: number; phaseRad: number }[]; cycles: number; perCycle: number }, shift = 0, scale = 1, offset = 0) {
  const terms = [{ order: 1, peak: 5 }, ...s.terms.filter((t) => t.order > 1).map((t) => ({ ...t, peak: Math.min(t.peak, 4 / (t.order * s.terms.length)) }))];
  const shape = fourierSeries(terms, s.dc);
  const x = sampled((p) => scale * shape(p) + offset, s.perCycle, s.cycles, shift);
  return analyzeChannel(x, s.perCycle * 50);
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-12);

describe('engine properties', () => {
  it('Parseval: rms² = mean² + Σ harmonic rms² for band-limited signals', () => {
    fc.assert(
      fc.property(series, (s) => {
        const a = build(s);
        const sum = a.harmonics.reduce((acc, h) => acc + h.rms ** 2, 0);
        expect(rel(a.rms ** 2, a.mean ** 2 + sum)).toBeLessThan(1e-9);
      }),
      { numRuns: 60 },
    );
  });

  it('linearity: scaling the input scales every amplitude figure', () => {
    fc.assert(
      fc.property(series, fc.double({ min: 0.001, max: 1000, noNaN: true }), (s, k) => {
        const a = build(s);
        const b = build(s, 0, k);
        for (const key of ['rms', 'acRms', 'rectifiedAverage', 'peak', 'peakToPeak'] as const) expect(rel(b[key], k * a[key])).toBeLessThan(1e-9);
        expect(rel(b.harmonics[0].rms, k * a.harmonics[0].rms)).toBeLessThan(1e-9);
        expect(rel(b.meters.averageResponding.reading, k * a.meters.averageResponding.reading)).toBeLessThan(1e-9);
        expect(rel(b.meters.peakResponding.reading, k * a.meters.peakResponding.reading)).toBeLessThan(1e-9);
      }),
      { numRuns: 40 },
    );
  });

  it('a DC offset changes neither the AC RMS nor any harmonic magnitude', () => {
    fc.assert(
      fc.property(series, fc.double({ min: -100, max: 100, noNaN: true }), (s, offset) => {
        const a = build(s);
        const b = build(s, 0, 1, offset);
        expect(Math.abs(b.acRms - a.acRms)).toBeLessThan(1e-9 * (1 + Math.abs(offset)));
        a.harmonics.forEach((h, i) => expect(Math.abs(b.harmonics[i].rms - h.rms)).toBeLessThan(1e-9 * (1 + Math.abs(offset))));
      }),
      { numRuns: 40 },
    );
  });

  it('a time shift of a whole-cycle record changes neither the AC RMS nor any harmonic magnitude', () => {
    fc.assert(
      fc.property(series, fc.double({ min: 0, max: 1, noNaN: true }), (s, shift) => {
        const a = build(s);
        const b = build(s, shift);
        expect(rel(b.acRms, a.acRms)).toBeLessThan(1e-9);
        a.harmonics.forEach((h, i) => expect(Math.abs(b.harmonics[i].rms - h.rms)).toBeLessThan(1e-9 * a.acRms));
      }),
      { numRuns: 40 },
    );
  });

  it('the averaging meter shows the true RMS of any sine (amplitude, phase, DC offset)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 1000, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }), (A, shift, dcRatio) => {
        const x = sampled((p) => dcRatio * A + A * Math.sin(2 * Math.PI * p), 2000, 5, shift);
        const a = analyzeChannel(x, 100000);
        // midpoint-rule error of |sin| around crossings between samples: (π/2000)² ≈ 2.5e-6
        expect(rel(a.meters.averageResponding.reading, A / Math.SQRT2)).toBeLessThan(1e-5);
      }),
      { numRuns: 40 },
    );
  });
});
