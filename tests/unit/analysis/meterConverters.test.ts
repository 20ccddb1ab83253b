/**
 * The three converters of buildFrontEnd against closed forms, each with its source beside it.
 *
 * Signals are midpoint-sampled whole periods (tests/helpers/signals), 2000 samples a period, so the
 * sampled means of |x| and x² differ from their integrals by less than (π/2000)²/6 = 4·10⁻⁷. Sine
 * components carry the line-joining gain (sin(ωh/2)/(ωh/2))² of the sections' discretisation (see
 * frontEndSections.test.ts), applied beside each expected ripple.
 */
import { describe, expect, it } from 'vitest';
import { buildFrontEnd, dtftAt, resolveFrontEnd, SINE_FORM_FACTOR } from '../../../shared/analysis';
import type { FrontEndProfile } from '../../../shared/schemas/meterSimulation';
import { sampled, shapes } from '../../helpers/signals';

const F = 50;
const PER = 2000;
const FS = F * PER;
const W = 2 * Math.PI * F;
const A = 2;
const k = Math.PI / (2 * Math.SQRT2);

const chain = (p: FrontEndProfile, fs = FS) => buildFrontEnd(resolveFrontEnd(p), fs);
const lineGain = (hz: number) => (Math.sin((Math.PI * hz) / FS) / ((Math.PI * hz) / FS)) ** 2;
const amplitudeAt = (x: Float64Array, hz: number) => {
  const { re, im } = dtftAt(x, 0, x.length, hz / FS);
  return (2 * Math.hypot(re, im)) / x.length;
};
const meanOf = (x: Float64Array) => x.reduce((s, v) => s + v, 0) / x.length;
const spanOf = (x: Float64Array) => Math.max(...x) - Math.min(...x);

describe('averaging converter (precision full-wave rectifier, RC averaging, × π/(2√2))', () => {
  // Fourier series of |A sin ωt| = 2A/π − (4A/π)·Σ_{even h} cos(hωt)/(h² − 1): Kreyszig, Advanced
  // Engineering Mathematics, Fourier series chapter (from memory); each term then passes the RC
  // low-pass with gain 1/√(1 + (hωτ)²).
  const tau = 0.02;
  const term = (h: number) => (4 * A) / (Math.PI * (h * h - 1)) / Math.sqrt(1 + (h * W * tau) ** 2);
  const settled = chain({ type: 'averaging', coupling: 'dc', averagingTauS: tau }).settleOn(sampled(shapes.sine(A), PER, 1)).output;
  const filtered = settled.map((v) => v / SINE_FORM_FACTOR);

  it('the DC part of the rectified sine is 2A/π', () => {
    expect(Math.abs(meanOf(filtered) / ((2 * A) / Math.PI) - 1)).toBeLessThan(1e-6);
  });

  it('the 2f ripple amplitude is (4A/3π)/√(1 + (2ωτ)²), and the 4f term is (4A/15π)/√(1 + (4ωτ)²)', () => {
    expect(Math.abs(amplitudeAt(filtered, 2 * F) / (term(2) * lineGain(2 * F)) - 1)).toBeLessThan(1e-5);
    expect(Math.abs(amplitudeAt(filtered, 4 * F) / (term(4) * lineGain(4 * F)) - 1)).toBeLessThan(1e-4);
  });

  it('peak-to-peak ripple is twice the 2f term, give or take the neglected terms from 4f up (the 4f one alone is 10 % of the 2f one once ωτ ≫ 1)', () => {
    // a₄/a₂ = (1/5)·√(1 + (2ωτ)²)/√(1 + (4ωτ)²) → 1/10 as ωτ grows: never negligible for the shape of
    // the ripple, so the peak-to-peak value is bounded by the sum of all the higher terms.
    expect(term(4) / term(2)).toBeGreaterThan(0.1);
    expect(term(4) / term(2)).toBeLessThan(0.101);
    let higher = 0;
    for (let h = 4; h <= 400; h += 2) higher += term(h);
    expect(Math.abs(spanOf(filtered) - 2 * term(2))).toBeLessThanOrEqual(2 * higher);
  });

  it('the sine calibration π/(2√2) = 1.1107 turns the settled reading on a sine into its RMS, within the residual ripple', () => {
    expect(SINE_FORM_FACTOR.toFixed(4)).toBe('1.1107');
    expect(Math.abs(meanOf(settled) / (A / Math.SQRT2) - 1)).toBeLessThan(1e-6);
    const ripple = spanOf(settled);
    expect(settled.every((v) => Math.abs(v - A / Math.SQRT2) <= ripple)).toBe(true);
  });

  it('AC-coupled, a DC step reads k·A·τc/(τc − τa)·(e^(−t/τc) − e^(−t/τa)): it decays with τc', () => {
    // The coupling output A·e^(−t/τc), rectified (it stays positive) and averaged: the convolution of
    // e^(−t/τc)/… with the RC's impulse response e^(−t/τa)/τa (standard calculus).
    const [tauC, tauA] = [0.1, 0.01];
    const y = new Float64Array(FS).fill(A);
    const fe = chain({ type: 'averaging', coupling: 'ac', couplingTauS: tauC, averagingTauS: tauA });
    fe.reset();
    fe.process(y, y.length);
    for (const n of [0, 100, 1000, 10_000, 50_000, 99_999]) {
      const t = n / FS;
      const expected = ((k * A * tauC) / (tauC - tauA)) * (Math.exp(-t / tauC) - Math.exp(-t / tauA));
      expect(Math.abs(y[n] - expected) / (k * A), `t = ${t} s`).toBeLessThan(1e-7);
    }
    // Long after the RC has caught up the reading falls by e per τc.
    expect(Math.log(y[30_000] / y[40_000])).toBeCloseTo(0.1 / tauC, 6);
  });
});

describe('half-wave averaging converter (× 2, as some designs do)', () => {
  it('reads a sine like the full-wave one, its ripple led by f: 2·(A/2)/√(1 + (ωτ)²), then 2·(2A/3π)/√(1 + (2ωτ)²) at 2f', () => {
    // Half-wave rectified sine A/π + (A/2)·sin ωt − (2A/π)·Σ_{even h} cos(hωt)/(h² − 1): Kreyszig,
    // Advanced Engineering Mathematics, Fourier series chapter (from memory); doubled by the converter.
    const tau = 0.5;
    const half = chain({ type: 'averaging', coupling: 'dc', averagingTauS: tau, rectifier: 'half' }).settleOn(sampled(shapes.sine(A), PER, 1)).output;
    const raw = half.map((v) => v / SINE_FORM_FACTOR);
    expect(Math.abs(meanOf(half) / (A / Math.SQRT2) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(amplitudeAt(raw, F) / ((A / Math.sqrt(1 + (W * tau) ** 2)) * lineGain(F)) - 1)).toBeLessThan(1e-5);
    expect(Math.abs(amplitudeAt(raw, 2 * F) / (((4 * A) / (3 * Math.PI) / Math.sqrt(1 + (2 * W * tau) ** 2)) * lineGain(2 * F)) - 1)).toBeLessThan(1e-4);
  });
});

describe('true RMS converters on a sine of frequency f', () => {
  // x² = A²/2 − (A²/2)·cos 2ωt exactly (sin² = (1 − cos 2θ)/2), so the filtered mean square is its DC
  // part plus one ripple term r·cos(2ωt + φ), and the root swings from √(A²/2 − r) to √(A²/2 + r).
  const tau = 0.05;
  const loop = sampled(shapes.sine(A), PER, 1);
  const m = (A * A) / 2;
  const check = (out: Float64Array, r: number) => {
    const meanSquare = out.map((v) => v * v);
    expect(Math.abs(meanOf(meanSquare) / m - 1)).toBeLessThan(1e-6);
    expect(Math.abs(amplitudeAt(meanSquare, 2 * F) / r - 1)).toBeLessThan(1e-5);
    expect(Math.abs(spanOf(out) / (Math.sqrt(m + r) - Math.sqrt(m - r)) - 1)).toBeLessThan(1e-5);
  };

  it('explicit (square, average with τr, root): mean-square ripple (A²/2)/√(1 + (2ωτr)²), and its root', () => {
    const out = chain({ type: 'trueRms', coupling: 'dc', averagingTauS: tau, rmsConverter: 'explicit' }).settleOn(loop).output;
    check(out, (m / Math.sqrt(1 + (2 * W * tau) ** 2)) * lineGain(2 * F));
  });

  it('implicit (τr·dy/dt = x²/y − y): its mean square y² averages with τr/2, so the ripple is (A²/2)/√(1 + (ωτr)²)', () => {
    // AD536/AD637 data sheets and Analog Devices' RMS-to-DC Converter Application Guide describe the
    // implicit loop (from memory); with z = y² the loop reads (τr/2)·dz/dt = x² − z (derived here), so
    // the formula above holds for it with τr/2 in place of τr.
    const out = chain({ type: 'trueRms', coupling: 'dc', averagingTauS: tau }).settleOn(loop).output;
    check(out, (m / Math.sqrt(1 + (W * tau) ** 2)) * lineGain(2 * F));
  });

  it('implicit: from connection it settles to 1 % in (τ/2)·ln(1/(1 − 0.99²)) = 1.959 τ whatever the level', () => {
    // z = A²(1 − e^(−2t/τ)), so y = A·√(1 − e^(−2t/τ)) reaches 0.99·A at that time (derived here).
    for (const level of [0.01, 1, 300]) {
      const y = new Float64Array(FS).fill(level);
      const fe = chain({ type: 'trueRms', coupling: 'dc', averagingTauS: tau });
      fe.reset();
      fe.process(y, y.length);
      const t = y.findIndex((v) => v >= 0.99 * level) / FS;
      expect(Math.abs(t - (tau / 2) * Math.log(1 / (1 - 0.99 ** 2)))).toBeLessThanOrEqual(1 / FS);
    }
  });

  it('implicit: falling to a tenth of its level takes longer, (τ/2)·ln((1 − r²)/(r²·(1.01² − 1))) = 4.25 τ for r = 0.1', () => {
    // z falls from A² towards (rA)² as e^(−2t/τ); it is within 1 % when z ≤ (1.01·rA)² (derived here).
    const r = 0.1;
    const fe = chain({ type: 'trueRms', coupling: 'dc', averagingTauS: tau });
    fe.settleOn(Float64Array.of(A, A));
    const y = new Float64Array(FS).fill(r * A);
    fe.process(y, y.length);
    const t = (y.findIndex((v) => v <= 1.01 * r * A) + 1) / FS;
    const expected = (tau / 2) * Math.log((1 - r * r) / (r * r * (1.01 ** 2 - 1)));
    expect(expected / tau).toBeCloseTo(4.25, 2);
    expect(Math.abs(t - expected)).toBeLessThanOrEqual(1 / FS);
  });
});

describe('peak converter (diode, hold capacitor, × 1/√2)', () => {
  it('reads a sine as A/√2, drooping between crests until the next one rises to meet it', () => {
    // The hold voltage decays as e^(−t/τl) from a crest until the rectified sine, rising towards the
    // next crest, meets it Δ before that crest: the trough d solves d = e^(−(T/2 − Δ)/τl) with
    // cos(ωΔ) = d (derived here from the circuit's description; Helfrick & Cooper, from memory).
    const tauL = 2;
    const out = chain({ type: 'peak', coupling: 'dc', averagingTauS: tauL }).settleOn(sampled(shapes.sine(A), PER, 1)).output;
    const top = (A * Math.cos(Math.PI / PER)) / Math.SQRT2; // the sampled crest lies half a step from the peak
    expect(Math.max(...out)).toBeCloseTo(top, 12);
    let d = 1;
    for (let i = 0; i < 100; i++) d = Math.exp(-(1 / (2 * F) - Math.acos(d) / W) / tauL);
    expect(d).toBeGreaterThan(Math.exp(-1 / (2 * F) / tauL));
    // The sampled trough can miss the continuous one by one step of decay, h/τl.
    expect(Math.abs(Math.min(...out) / top - d)).toBeLessThan(1 / (FS * tauL));
  });
});
