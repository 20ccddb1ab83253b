import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeChannel, dtftAt, harmonics } from '../../../shared/analysis';
import { fourierSeries, sampled, shapes } from '../../helpers/signals';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('harmonics', () => {
  it('square ±A: odd harmonics 4A/(hπ) in peak, even ones zero (Fourier series; Kreyszig, from memory)', () => {
    const A = 3;
    const perCycle = 20000; // DOMAIN caution: aliasing of a sampled square wave is 0.0025 % at h = 39 with 10 000 per cycle
    const x = sampled(shapes.square(A), perCycle, 4);
    const r = harmonics(x, 0, x.length, 4, 50 * perCycle, 50);
    for (const h of r.harmonics) {
      const peak = h.rms * Math.SQRT2;
      if (h.order % 2 === 1) expect(rel(peak, (4 * A) / (h.order * Math.PI))).toBeLessThan(5e-5);
      else expect(peak / A).toBeLessThan(1e-9);
    }
    // THD-F to order 50: 0.472971 (DOMAIN table 2b, computed from the series); infinite series √(π²/8 − 1) = 0.483426.
    expect(rel(r.thdPercent! / 100, 0.472971)).toBeLessThan(1e-4);
    expect(r.thdPercent! / 100).toBeLessThan(Math.sqrt(Math.PI ** 2 / 8 - 1));
    // THD-R = THD-F/√(1 + THD-F²) (algebra of the two definitions)
    const thdF = r.thdPercent! / 100;
    expect(rel(r.thdRPercent! / 100, thdF / Math.sqrt(1 + thdF ** 2))).toBeLessThan(1e-9);
  });

  it('triangle ±A: odd harmonics 8A/(π²h²), THD-F to 50 = 0.121147 (Fourier series; Kreyszig, from memory)', () => {
    const x = sampled(shapes.triangle(1), 10000, 3);
    const r = harmonics(x, 0, x.length, 3, 500000, 50);
    expect(rel(r.harmonics[0].rms * Math.SQRT2, 8 / Math.PI ** 2)).toBeLessThan(1e-6);
    expect(rel(r.harmonics[4].rms * Math.SQRT2, 8 / (Math.PI ** 2 * 25))).toBeLessThan(1e-5);
    expect(r.harmonics[1].rms).toBeLessThan(1e-9);
    expect(rel(r.thdPercent! / 100, 0.121147)).toBeLessThan(1e-4);
  });

  it('sawtooth ±A: every harmonic 2A/(πh), THD-F to 50 = 0.790653 (Fourier series; Kreyszig, from memory)', () => {
    const x = sampled(shapes.sawtooth(1), 20000, 3);
    const r = harmonics(x, 0, x.length, 3, 1e6, 50);
    for (const h of [1, 2, 3, 10, 25]) expect(rel(r.harmonics[h - 1].rms * Math.SQRT2, 2 / (Math.PI * h))).toBeLessThan(1e-4);
    expect(rel(r.thdPercent! / 100, 0.790653)).toBeLessThan(2e-4);
  });

  it('a sine with 5 % 3rd and 3 % 5th: THD-F = √(0.05² + 0.03²) (definition, IEC 61000-4-7)', () => {
    const shape = fourierSeries([{ order: 1, peak: 10 }, { order: 3, peak: 0.5, phaseRad: 1 }, { order: 5, peak: 0.3, phaseRad: -2 }]);
    const a = analyzeChannel(sampled(shape, 997, 10), 997 * 50);
    expect(rel(a.thdPercent! / 100, Math.sqrt(0.05 ** 2 + 0.03 ** 2))).toBeLessThan(1e-9);
    expect(a.harmonics[2].frequency).toBeCloseTo(150, 6);
  });

  it('reports phases of cosine components at the window start', () => {
    const shape = fourierSeries([{ order: 1, peak: 1, phaseRad: Math.PI / 2 }, { order: 2, peak: 0.5 }]);
    const x = sampled(shape, 1024, 8, -0.5 / 1024); // shift so samples sit on t = n/perCycle
    const r = harmonics(x, 0, x.length, 8, 1024 * 50);
    // sin(θ + π/2) = cos θ → 0°; sin θ = cos(θ − 90°) → −90°
    expect(r.harmonics[0].phaseDeg).toBeCloseTo(0, 6);
    expect(r.harmonics[1].phaseDeg).toBeCloseTo(-90, 6);
  });

  it('stops below Nyquist: 10 samples per cycle give orders 1..4 only', () => {
    const x = sampled(shapes.sine(1), 10, 20);
    const r = harmonics(x, 0, x.length, 20, 500, 50);
    expect(r.harmonics.map((h) => h.order)).toEqual([1, 2, 3, 4]);
    expect(r.nyquistOrder).toBe(4);
  });

  it('gives the same result on the twiddle-table, full-transform and direct-bin paths', () => {
    const shape = fourierSeries([{ order: 1, peak: 1 }, { order: 7, peak: 0.2, phaseRad: 0.3 }]);
    const paths = [
      { perCycle: 64, cycles: 16 }, // 1024 points: a twiddle table
      { perCycle: 20000, cycles: 60 }, // 1.2 M points: summed to one period of 20 000, then a table
      { perCycle: 2 ** 17, cycles: 1 }, // one period of 2^17 points: one fft.js transform
      { perCycle: 90001 / 9, cycles: 9 }, // 90 001 points, gcd(9, 90 001) = 1: direct bins
    ];
    for (const { perCycle, cycles } of paths) {
      const x = sampled(shape, perCycle, cycles);
      expect(x.length).toBe(Math.round(perCycle * cycles));
      const r = harmonics(x, 0, x.length, cycles, 50 * perCycle, 31);
      expect(r.harmonics[6].rms).toBeCloseTo(0.2 / Math.SQRT2, 10);
      expect(r.harmonics[1].rms).toBeLessThan(1e-9);
      // sin(θ + φ) = cos(θ + φ − 90°), sampled from half a step in: + 7·180°/perCycle
      expect(r.harmonics[6].phaseDeg).toBeCloseTo((0.3 * 180) / Math.PI - 90 + (7 * 180) / perCycle, 7);
    }
  });

  it('takes a window of a fractional number of cycles by direct sums at those (fractional) bins', () => {
    // X(f) = Σ x[n]·e^(−j2πfn) at f = h·cycles/count, as dtftAt sums it one bin at a time.
    const x = sampled(fourierSeries([{ order: 1, peak: 1 }, { order: 3, peak: 0.1 }]), 400, 3);
    const r = harmonics(x, 0, 1000, 2.5, 20000, 5);
    for (const h of r.harmonics) {
      const { re, im } = dtftAt(x, 0, 1000, (h.order * 2.5) / 1000);
      expect(h.rms).toBeCloseTo((Math.SQRT2 * Math.hypot(re, im)) / 1000, 12);
    }
  });

  it('equals the DFT by its definition at bins h·cycles, whatever gcd(cycles, length) (X[k] = Σ x[n]·e^(−j2πkn/N))', () => {
    // The whole-cycle windows of real records share factors with their cycle counts (1 M samples of 50
    // cycles: 50) or none (997 of 3): both, and windows starting inside the record, must give the sums.
    const direct = (x: number[], start: number, n: number, k: number) => {
      let re = 0;
      let im = 0;
      for (let i = 0; i < n; i++) {
        re += x[start + i] * Math.cos((2 * Math.PI * k * i) / n);
        im -= x[start + i] * Math.sin((2 * Math.PI * k * i) / n);
      }
      return { re, im };
    };
    const window = fc
      .record({ cycles: fc.integer({ min: 1, max: 24 }), perCycle: fc.integer({ min: 4, max: 90 }), extra: fc.integer({ min: 0, max: 40 }), start: fc.integer({ min: 0, max: 30 }) })
      .chain((w) => {
        const count = w.cycles * w.perCycle + w.extra;
        return fc.record({ w: fc.constant({ ...w, count }), x: fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: w.start + count, maxLength: w.start + count }) });
      });
    fc.assert(
      fc.property(window, ({ w, x }) => {
        const r = harmonics(Float64Array.from(x), w.start, w.count, w.cycles, 1000, 50);
        const scale = x.reduce((s, v) => s + Math.abs(v), 0) + 1;
        for (const h of r.harmonics) {
          const { re, im } = direct(x, w.start, w.count, h.order * w.cycles);
          expect(Math.abs(h.rms - (Math.SQRT2 * Math.hypot(re, im)) / w.count)).toBeLessThan(1e-9 * scale);
        }
      }),
      { numRuns: 300 },
    );
  });
});
