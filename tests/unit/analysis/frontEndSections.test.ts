/**
 * The front end's filter sections against the closed forms of their circuits.
 *
 * Sources: the RC charging curve 1 − e^(−t/τ) and the RC high-pass's decay e^(−t/τ) (Horowitz & Hill,
 * The Art of Electronics, ch. 1, from memory); the two-pole step response 1 − e^(−t/τ)(1 + t/τ) and the
 * first-order gain 1/√(1 + (ωτ)²) are the inverse Laplace transforms of 1/(s(1 + sτ)²) and the
 * magnitude of 1/(1 + jωτ) (standard calculus; any network-analysis text, from memory). The sections
 * are exact for inputs that run linearly between samples, so step responses must match to rounding.
 * A sampled sine, joined by straight lines, keeps its own frequency scaled by (sin(ωh/2)/(ωh/2))²
 * (the triangle kernel's transform; Oppenheim & Schafer, Discrete-Time Signal Processing, on linear
 * interpolation, from memory); what its images fold back stays below 10⁻⁶ at 200 samples a period.
 */
import { describe, expect, it } from 'vitest';
import { CouplingHighPass, DoublePoleLowPass, dtftAt, FirstOrderLowPass, PeakHold } from '../../../shared/analysis';

const step = (n: number, level = 1) => new Float64Array(n).fill(level);
const TAUS = [1e-3, 3e-3, 1e-2, 0.1, 1, 10];
const RATES = [10_000, 5_000_000];

/** The straight-line joining's gain at ωh: (sin(ωh/2)/(ωh/2))². */
const lineGain = (hz: number, fs: number) => (Math.sin((Math.PI * hz) / fs) / ((Math.PI * hz) / fs)) ** 2;

/** Amplitude of the component at `hz` over whole periods of a loop sampled at `fs`. */
function amplitudeAt(x: Float64Array, hz: number, fs: number): number {
  const { re, im } = dtftAt(x, 0, x.length, hz / fs);
  return (2 * Math.hypot(re, im)) / x.length;
}

describe('FirstOrderLowPass', () => {
  it('unit step from connection: 1 − e^(−t/τ) at every sample, and 99 % after 4.605 τ (ln 100)', () => {
    const fs = 10_000;
    const tau = 0.02;
    const y = step(2000);
    new FirstOrderLowPass(tau, fs).process(y, y.length);
    for (let n = 0; n < y.length; n++) expect(Math.abs(y[n] - (1 - Math.exp(-n / (fs * tau))))).toBeLessThan(1e-12);
    const first99 = y.findIndex((v) => v >= 0.99);
    expect(Math.abs(first99 / fs - Math.log(100) * tau)).toBeLessThanOrEqual(1 / fs);
    expect(Math.log(100)).toBeCloseTo(4.605, 3);
  });

  it('sine in periodic steady state: gain 1/√(1 + (ωτ)²) times the line joining’s gain', () => {
    const fs = 10_000;
    const f = 50;
    for (const tau of [1e-3, 0.01, 1]) {
      const loop = Float64Array.from({ length: fs / f }, (_, n) => Math.sin((2 * Math.PI * f * n) / fs));
      new FirstOrderLowPass(tau, fs).settle(loop);
      const expected = lineGain(f, fs) / Math.sqrt(1 + (2 * Math.PI * f * tau) ** 2);
      expect(Math.abs(amplitudeAt(loop, f, fs) / expected - 1), `τ ${tau} s`).toBeLessThan(1e-6);
    }
  });

  for (const fs of RATES) {
    it(`stays exact and bounded for τ from 1 ms to 10 s at ${fs / 1000} kS/s`, () => {
      const n = Math.min(1_000_000, fs * 2);
      for (const tau of TAUS) {
        const y = step(n);
        new FirstOrderLowPass(tau, fs).process(y, n);
        for (const i of [1, n >> 4, n >> 1, n - 1]) {
          const exact = 1 - Math.exp(-i / (fs * tau));
          expect(Math.abs(y[i] - exact) / exact, `τ ${tau} s, sample ${i}`).toBeLessThan(1e-8);
        }
        expect(y.every((v, i) => v >= 0 && v <= 1 && (i === 0 || v >= y[i - 1]))).toBe(true);
      }
    });
  }
});

describe('CouplingHighPass', () => {
  it('a DC step of height A from connection reads A·e^(−t/τc) at every sample', () => {
    const fs = 10_000;
    const tauC = 0.1;
    const A = 230;
    const y = step(5000, A);
    new CouplingHighPass(tauC, fs).process(y, y.length);
    for (let n = 0; n < y.length; n++) expect(Math.abs(y[n] - A * Math.exp(-n / (fs * tauC))) / A).toBeLessThan(1e-12);
  });

  it('in periodic steady state blocks the DC part of a sine on a DC level exactly', () => {
    const fs = 10_000;
    const loop = Float64Array.from({ length: 2000 }, (_, n) => 50 + 10 * Math.sin((2 * Math.PI * 50 * n) / fs));
    new CouplingHighPass(1, fs).settle(loop);
    expect(Math.abs(loop.reduce((s, v) => s + v, 0) / loop.length)).toBeLessThan(1e-9);
  });

  for (const fs of RATES) {
    it(`stays exact for τc from 1 ms to 10 s at ${fs / 1000} kS/s`, () => {
      const n = Math.min(1_000_000, fs * 2);
      for (const tau of TAUS) {
        const y = step(n);
        new CouplingHighPass(tau, fs).process(y, n);
        const i = n >> 1;
        const exact = Math.exp(-i / (fs * tau));
        expect(Math.abs(y[i] - exact), `τc ${tau} s`).toBeLessThan(1e-9 * Math.max(exact, 1e-3));
      }
    });
  }
});

describe('DoublePoleLowPass', () => {
  it('unit step: 1 − e^(−t/τ)(1 + t/τ) at every sample; 99 % after 6.638 τ', () => {
    const fs = 10_000;
    const tau = 0.01;
    const y = step(3000);
    new DoublePoleLowPass(tau, fs).process(y, y.length);
    for (let n = 0; n < y.length; n++) {
      const x = n / (fs * tau);
      expect(Math.abs(y[n] - (1 - Math.exp(-x) * (1 + x)))).toBeLessThan(1e-12);
    }
    // e^(−x)(1 + x) = 0.01, solved here by bisection: x = 6.6384.
    let lo = 1, hi = 20;
    for (let k = 0; k < 60; k++) {
      const mid = (lo + hi) / 2;
      if (Math.exp(-mid) * (1 + mid) > 0.01) lo = mid;
      else hi = mid;
    }
    expect(lo).toBeCloseTo(6.6384, 4);
    expect(Math.abs(y.findIndex((v) => v >= 0.99) / fs - lo * tau)).toBeLessThanOrEqual(1 / fs);
  });

  it('sine in periodic steady state: gain 1/(1 + (ωτ)²)', () => {
    const fs = 10_000;
    const f = 50;
    const tau = 0.01;
    const loop = Float64Array.from({ length: fs / f }, (_, n) => Math.sin((2 * Math.PI * f * n) / fs));
    new DoublePoleLowPass(tau, fs).settle(loop);
    const expected = lineGain(f, fs) / (1 + (2 * Math.PI * f * tau) ** 2);
    expect(Math.abs(amplitudeAt(loop, f, fs) / expected - 1)).toBeLessThan(1e-6);
  });

  for (const fs of RATES) {
    it(`stays exact for τ from 1 ms to 10 s at ${fs / 1000} kS/s`, () => {
      const n = Math.min(1_000_000, fs * 2);
      for (const tau of TAUS) {
        const y = step(n);
        new DoublePoleLowPass(tau, fs).process(y, n);
        const x = (n - 1) / (fs * tau);
        const exact = 1 - Math.exp(-x) * (1 + x);
        expect(Math.abs(y[n - 1] - exact) / exact, `τ ${tau} s`).toBeLessThan(1e-7);
        expect(y.every((v) => v >= 0 && v <= 1)).toBe(true);
      }
    });
  }
});

describe('PeakHold', () => {
  it('ideal diode: holds the peak, then leaks as e^(−t/τl)', () => {
    const fs = 10_000;
    const tauL = 0.5;
    // One positive half-sine of peak 2 (10 ms), then nothing.
    const x = Float64Array.from({ length: 3000 }, (_, n) => (n <= 100 ? 2 * Math.sin((Math.PI * n) / 100) : 0));
    new PeakHold(tauL, null, fs).process(x, x.length);
    expect(x[50]).toBeCloseTo(2, 12);
    for (const n of [200, 1000, 2999]) expect(x[n] / (2 * Math.exp(-(n - 50) / (fs * tauL)))).toBeCloseTo(1, 12);
  });

  it('through a source resistance: a constant u charges it to u·τl/(τc + τl) with τc·τl/(τc + τl)', () => {
    const fs = 10_000;
    const [tauC, tauL, u] = [0.01, 1, 3];
    const y = step(2000, u);
    new PeakHold(tauL, tauC, fs).process(y, y.length);
    const target = (u * tauL) / (tauC + tauL);
    const tauE = (tauC * tauL) / (tauC + tauL);
    for (const n of [0, 10, 100, 1999]) expect(Math.abs(y[n] - target * (1 - Math.exp(-n / (fs * tauE))))).toBeLessThan(1e-12);
  });

  for (const fs of RATES) {
    it(`stays bounded by the input's peak for τ from 1 ms to 10 s at ${fs / 1000} kS/s`, () => {
      const n = Math.min(200_000, fs / 5);
      for (const tau of TAUS) {
        for (const charge of [null, 1e-4]) {
          const y = Float64Array.from({ length: n }, (_, i) => Math.abs(Math.sin((2 * Math.PI * 50 * i) / fs)));
          new PeakHold(tau, charge, fs).process(y, n);
          expect(y.every((v) => Number.isFinite(v) && v >= 0 && v <= 1 + 1e-12), `τl ${tau} s, charge ${charge}`).toBe(true);
          expect(y[n - 1]).toBeGreaterThan(charge === null ? Math.exp(-0.01 / tau) - 1e-9 : 0.1);
        }
      }
    });
  }
});
